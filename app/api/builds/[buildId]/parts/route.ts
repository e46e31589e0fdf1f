import { withBuild } from "@/lib/http";
import { partsHandlers } from "@/lib/parts-routes";

/** The build's parts library: every member reads it, owner and builders change it. */
export const GET = withBuild("read", async ({ req, build }) => partsHandlers.list({ buildId: build.id }, req));
export const POST = withBuild("edit", async ({ req, build }) => partsHandlers.create({ buildId: build.id }, req));
