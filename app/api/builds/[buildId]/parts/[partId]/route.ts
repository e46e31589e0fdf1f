import { withBuild } from "@/lib/http";
import { partsHandlers } from "@/lib/parts-routes";

type P = { buildId: string; partId: string };
export const PUT = withBuild<P>("edit", async ({ req, build, params }) => partsHandlers.update({ buildId: build.id }, req, params.partId));
export const DELETE = withBuild<P>("edit", async ({ build, params }) => partsHandlers.remove({ buildId: build.id }, params.partId));
