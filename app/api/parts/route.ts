import { withUser } from "@/lib/http";
import { partsHandlers } from "@/lib/parts-routes";

/** The signed-in user's own parts library. */
export const GET = withUser(async ({ user }) => partsHandlers.list({ userId: user.id }));
export const POST = withUser(async ({ req, user }) => partsHandlers.create({ userId: user.id }, req));
