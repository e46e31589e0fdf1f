import { withUser } from "@/lib/http";
import { partsHandlers } from "@/lib/parts-routes";

/** The signed-in user's own parts library. */
export const GET = withUser(async ({ req, user }) => partsHandlers.list({ userId: user.id }, req));
export const POST = withUser(async ({ req, user }) => partsHandlers.create({ userId: user.id }, req));
