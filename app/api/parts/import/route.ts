import { withUser } from "@/lib/http";
import { partsHandlers } from "@/lib/parts-routes";

/** `{csv, skipBadRows?, dryRun?}` → a row-by-row report; see lib/parts-routes.ts. */
export const POST = withUser(async ({ req, user }) => partsHandlers.importCsv({ userId: user.id }, req));
