import { withBuild } from "@/lib/http";
import { partsHandlers } from "@/lib/parts-routes";

export const POST = withBuild("edit", async ({ req, build }) => partsHandlers.importCsv({ buildId: build.id }, req));
