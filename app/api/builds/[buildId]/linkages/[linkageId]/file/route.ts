import { withLinkage } from "@/lib/http";
import { serializeLinkage } from "@/shared/linkage/io";

/** The linkage as a file in the linkage format (`?revision=N` for an older one), to keep outside Linkwright. */
export const GET = withLinkage("read", { revision: "requested" }, async ({ linkage, revision: rev }) => {
  const base = (linkage.name || "linkage").toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "linkage";
  return new Response(serializeLinkage({ ...rev.graph, name: linkage.name, system: linkage.system }), {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="${base}-rev${rev.revision}.linkage.json"`,
      "x-content-type-options": "nosniff",
    },
  });
});
