import { withUser } from "@/lib/http";
import { partsHandlers } from "@/lib/parts-routes";

type P = { partId: string };
/** Replace a part of one's own library (the whole part: kind, part number, description, spec). */
export const PUT = withUser<P>(async ({ req, user, params }) => partsHandlers.update({ userId: user.id }, req, params.partId));
export const DELETE = withUser<P>(async ({ user, params }) => partsHandlers.remove({ userId: user.id }, params.partId));
