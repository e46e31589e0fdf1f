import { withSiteAdmin, json } from "@/lib/http";
import { listUsersForAdmin } from "@/db/users";

export const GET = withSiteAdmin(async () => json({ users: await listUsersForAdmin() }));
