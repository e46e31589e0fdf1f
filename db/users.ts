import "server-only";
import { db } from "./index";
import type { NotifyPref, PublicUser } from "@/shared/schemas/users";

export type UserRow = {
  id: string;
  email: string;
  name: string;
  password_hash: string;
  is_site_admin: boolean;
  unit_system: "US" | "SI";
  created_at: Date;
};
export type { PublicUser };

export const toPublicUser = (u: UserRow): PublicUser => ({
  id: u.id,
  email: u.email,
  name: u.name,
  isSiteAdmin: u.is_site_admin,
  unitSystem: u.unit_system,
});

export const findUserByEmail = (email: string) =>
  db<UserRow>("users").whereRaw("lower(email) = lower(?)", [email]).first();
export const findUserById = (id: string) => db<UserRow>("users").where({ id }).first();

export async function createUser(u: { email: string; name: string; passwordHash: string }) {
  const [row] = await db<UserRow>("users")
    .insert({ email: u.email.trim(), name: u.name.trim(), password_hash: u.passwordHash })
    .returning("*");
  return row;
}

export const setUnitSystem = (id: string, unit: "US" | "SI") => db("users").where({ id }).update({ unit_system: unit });

const WINDOW_MIN = 15;
export const MAX_FAILS_PER_EMAIL = 5;
export const MAX_FAILS_PER_IP = 30;

/** Failed sign-ins in the last window, per e-mail and per IP. */
export async function recentFailures(email: string, ip: string) {
  const since = db.raw(`now() - interval '${WINDOW_MIN} minutes'`);
  const [byEmail] = await db("sign_in_attempts").whereRaw("lower(email) = lower(?)", [email]).where("created_at", ">", since).count<{ count: string }[]>("* as count");
  const [byIp] = await db("sign_in_attempts").where({ ip }).where("created_at", ">", since).count<{ count: string }[]>("* as count");
  return { email: Number(byEmail.count), ip: Number(byIp.count) };
}
export const recordFailure = (email: string, ip: string) => db("sign_in_attempts").insert({ email: email.slice(0, 254), ip: ip.slice(0, 64) });
export const clearFailures = (email: string) => db("sign_in_attempts").whereRaw("lower(email) = lower(?)", [email]).del();

export async function listUsersForAdmin() {
  const rows = await db("users as u")
    .select("u.id", "u.email", "u.name", "u.is_site_admin", "u.created_at", db.raw("(select count(*)::int from memberships m where m.user_id = u.id) as builds"))
    .orderBy("u.created_at", "asc");
  return rows.map((r: { id: string; email: string; name: string; is_site_admin: boolean; created_at: Date; builds: number }) => ({
    id: r.id,
    email: r.email,
    name: r.name,
    isSiteAdmin: r.is_site_admin,
    createdAt: r.created_at.toISOString(),
    builds: r.builds,
  }));
}

export async function setSiteAdmin(id: string, isSiteAdmin: boolean) {
  return db.transaction(async (trx) => {
    if (!isSiteAdmin) {
      const [{ count }] = await trx("users").where({ is_site_admin: true }).whereNot({ id }).count<{ count: string }[]>("* as count");
      if (Number(count) === 0) return "last_admin" as const;
    }
    const n = await trx("users").where({ id }).update({ is_site_admin: isSiteAdmin });
    return n ? ("ok" as const) : ("missing" as const);
  });
}

// ---- review e-mail -----------------------------------------------------------------------------

/** Someone a review e-mail may go to, with their choice of which ones they get. */
export type Recipient = { id: string; email: string; name: string; notify: NotifyPref; role: string };

export async function getNotify(userId: string): Promise<NotifyPref> {
  const row = await db("users").where({ id: userId }).first("notify");
  return (row?.notify as NotifyPref) ?? "all";
}
export const setNotify = (userId: string, notify: NotifyPref) => db("users").where({ id: userId }).update({ notify });
