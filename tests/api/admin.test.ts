import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, snapshot, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";

let admin: Client;
let adminId: string;
let plain: { id: string; email: string };

beforeAll(async () => {
  // Only this test's admin may be an admin, so the last-admin rule can be exercised.
  await testDb("users").update({ is_site_admin: false });
  const a = await makeUser("site-admin");
  adminId = a.id;
  await testDb("users").where({ id: a.id }).update({ is_site_admin: true });
  admin = await signIn(a.email);
  plain = await makeUser("plain");
});
afterAll(() => testDb.destroy());

describe("site admin: user management only", () => {
  it("lists users without any build data and is not a member of builds", async () => {
    const owner = await makeUser("someone");
    const ids = await makeBuild({ owner });
    const r = await admin.request("GET", "/api/admin/users");
    expect(r.status).toBe(200);
    expect(r.body.users.map((u: { id: string }) => u.id)).toContain(plain.id);
    expect(r.body.users[0]).not.toHaveProperty("password_hash");
    expect((await admin.request("GET", `/api/builds/${ids.buildId}`)).status).toBe(404);
  });

  it("grants and removes admin rights, but never the last admin's", async () => {
    expect((await admin.request("PATCH", `/api/admin/users/${plain.id}`, { isSiteAdmin: true })).status).toBe(200);
    expect((await testDb("users").where({ id: plain.id }).first()).is_site_admin).toBe(true);
    expect((await admin.request("PATCH", `/api/admin/users/${plain.id}`, { isSiteAdmin: false })).status).toBe(200);
    const last = await admin.request("PATCH", `/api/admin/users/${adminId}`, { isSiteAdmin: false });
    expect(last.status).toBe(409);
    expect((await testDb("users").where({ id: adminId }).first()).is_site_admin).toBe(true);
  });

  it("rejects a malformed body with field errors and changes nothing", async () => {
    const before = await snapshot();
    const r = await admin.request("PATCH", `/api/admin/users/${plain.id}`, { isSiteAdmin: "yes" });
    expect(r.status).toBe(400);
    expect(Object.keys(r.body.error.fields)).toContain("isSiteAdmin");
    expect(await snapshot()).toEqual(before);
  });
});
