import { withUser } from "@/lib/http";
import { partsHandlers } from "@/lib/parts-routes";

export const GET = withUser(async ({ user }) => partsHandlers.exportCsv({ userId: user.id }, "my-parts.csv"));
