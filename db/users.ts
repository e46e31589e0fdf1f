import "server-only";
import { db } from "./index";
import { audit } from "./audit";
import type { NotifyPref, PublicUser } from "@/shared/schemas/users";

export type UserRow = {
  id: string;
  email: string;
  name: string;
  password_hash: string;
  /** Raised at sign-out: a cookie issued with an older version is refused. */
  session_version: number;
  is_site_admin: boolean;
  unit_system: "US" | "SI";
  created_at: Date;
};
export type { PublicUser };

export const toPublicUser = (u: Pick<UserRow, "id" | "email" | "name" | "is_site_admin" | "unit_system">): PublicUser => ({
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
/**
 * Failed sign-ins slow further guesses at an address rather than lock its owner out: after
 * MAX_FAILS_PER_EMAIL failures in the window, each further try must wait 15 s, doubling with every failure,
 * at most BACKOFF_MAX_S — so someone failing another person's address on purpose delays them by at most a
 * minute, while guessing is held to about one try a minute. Per address of the client, a hard limit.
 */
export const BACKOFF_BASE_S = 15; // common practice, no source: exponential backoff after a few failures
export const BACKOFF_MAX_S = 60; // common practice, no source

/**
 * One sign-in attempt, counted before the password is checked: the attempt's row is written first and the
 * failures counted after, so any number of guesses sent at the same moment cannot run past the limit
 * (each sees the others). Returns the attempt's id to settle, or why to refuse (the row is then removed:
 * a refused try checks no password).
 */
export async function beginAttempt(email: string, ip: string): Promise<{ id: string } | { refused: "ip" } | { refused: "email"; waitS: number }> {
  const [row] = await db("sign_in_attempts").insert({ email: email.slice(0, 254), ip: ip.slice(0, 64) }).returning(["id", "created_at"]);
  const since = db.raw(`now() - interval '${WINDOW_MIN} minutes'`);
  const [byEmail, byIp] = await Promise.all([
    db("sign_in_attempts").whereRaw("lower(email) = lower(?)", [email]).where("created_at", ">", since)
      .first(db.raw("count(*)::int as n"), db.raw("max(created_at) filter (where id <> ?) as prev", [row.id])),
    db("sign_in_attempts").where({ ip: ip.slice(0, 64) }).where("created_at", ">", since).first(db.raw("count(*)::int as n")),
  ]);
  const earlier = byEmail.n - 1;
  if (byIp.n > MAX_FAILS_PER_IP) {
    await db("sign_in_attempts").where({ id: row.id }).del();
    return { refused: "ip" };
  }
  if (earlier >= MAX_FAILS_PER_EMAIL && byEmail.prev) {
    const waitS = Math.min(BACKOFF_MAX_S, BACKOFF_BASE_S * 2 ** (earlier - MAX_FAILS_PER_EMAIL));
    const since = (row.created_at.getTime() - new Date(byEmail.prev).getTime()) / 1000;
    if (since < waitS) {
      await db("sign_in_attempts").where({ id: row.id }).del();
      return { refused: "email", waitS: Math.ceil(waitS - since) };
    }
  }
  return { id: row.id };
}
/** A successful sign-in clears the address's failures (its own attempt among them). */
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

/** A site admin grants or takes away site admin; the change and its audit event are one transaction. */
export async function setSiteAdmin(id: string, isSiteAdmin: boolean, byUserId: string) {
  return db.transaction(async (trx) => {
    if (!isSiteAdmin) {
      const [{ count }] = await trx("users").where({ is_site_admin: true }).whereNot({ id }).count<{ count: string }[]>("* as count");
      if (Number(count) === 0) return "last_admin" as const;
    }
    const n = await trx("users").where({ id }).update({ is_site_admin: isSiteAdmin });
    if (!n) return "missing" as const;
    await audit({ buildId: null, userId: byUserId, action: "admin.site-admin", detail: { target: id, isSiteAdmin } }, trx);
    return "ok" as const;
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

/** Ends every session of the user on the server: cookies issued before carry an older version and are refused. */
/** A new password: every session of the account ends with it (cookies carry the old session version). */
export const setPassword = (id: string, passwordHash: string) =>
  db("users").where({ id }).update({ password_hash: passwordHash, session_version: db.raw("session_version + 1") });

export const endSessions = (id: string) => db("users").where({ id }).increment("session_version", 1);
