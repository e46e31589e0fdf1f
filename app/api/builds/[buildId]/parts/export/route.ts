import { withBuild } from "@/lib/http";
import { partsHandlers } from "@/lib/parts-routes";
import { slug } from "@/lib/records-http";

export const GET = withBuild("read", async ({ build }) => partsHandlers.exportCsv({ buildId: build.id }, `${slug(build.name)}-parts.csv`));
