/**
 * A write and its audit event are one transaction: when the audit insert fails, the write is undone
 * and the answer is the plain 500 that says nothing was changed.
 *
 * No input the routes accept makes the audit insert fail any more (strings Postgres cannot store are
 * refused at the door, tests/api/hardening/bodies.test.ts), so the failure is made in the database: a
 * trigger on audit_events, created here and dropped after, refuses every event whose actor is this
 * file's user. Other users' events (other test files) are untouched.
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, snapshot, testDb } from "../../support/db";
import { signIn, type Client } from "../../support/http";
import { fixtureFile } from "../../support/upload";
import { demoPitchLinkage } from "@/shared/demo";

let owner: Client;
let ownerId: string;
let buildId: string;
let linkageId: string;
let other: { id: string; email: string };

beforeAll(async () => {
  const u = await makeUser("audit-trx");
  ownerId = u.id;
  other = await makeUser("audit-trx-other");
  ({ buildId, linkageId } = await makeBuild({ owner: u }));
  await testDb("users").where({ id: u.id }).update({ is_site_admin: true });
  await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 }).update({ graph: JSON.stringify(demoPitchLinkage()) });
  owner = await signIn(u.email);
  await testDb.raw(`
    create table test_refused_actors (user_id uuid not null, action text);
    create function test_refuse_audit() returns trigger language plpgsql as $$
    begin
      if exists (select 1 from test_refused_actors where user_id = new.user_id and (action is null or action = new.action)) then
        raise exception 'audit event refused by the test';
      end if;
      return new;
    end $$;
    create trigger test_refuse_audit before insert on audit_events for each row execute function test_refuse_audit();
  `);
});
afterAll(async () => {
  await testDb.raw(`
    drop trigger if exists test_refuse_audit on audit_events;
    drop function if exists test_refuse_audit();
    drop table if exists test_refused_actors;
  `);
  await testDb.destroy();
});

const B = () => `/api/builds/${buildId}`;
const L = () => `${B()}/linkages/${linkageId}`;

/** Runs one write with the audit insert refused (every event, or only `action`): a 500, and not one row changed anywhere. */
async function allOrNothing(method: string, path: string, body?: unknown, action?: string) {
  await testDb("test_refused_actors").insert({ user_id: ownerId, action: action ?? null });
  try {
    const before = await snapshot();
    const res = await owner.request(method, path, body);
    expect(res.status, `${method} ${path}: ${JSON.stringify(res.body)}`).toBe(500);
    expect(res.body.error.code).toBe("server_error");
    expect(await snapshot(), `${method} ${path} changed rows although its audit event was refused`).toEqual(before);
  } finally {
    await testDb("test_refused_actors").del();
  }
}

describe("a write whose audit event fails changes nothing", () => {
  it("renaming, then deleting a linkage", async () => {
    await allOrNothing("PATCH", L(), { name: "Renamed run" });
    expect((await testDb("linkages").where({ id: linkageId }).first()).name).toBe("Pitch run");
    await allOrNothing("DELETE", L());
    expect(await testDb("linkages").where({ id: linkageId }).first()).toBeTruthy();
  });

  it("editing and resolving a comment", async () => {
    const [c] = await testDb("comments")
      .insert({ build_id: buildId, linkage_id: linkageId, subject_type: "linkage", subject_id: linkageId, author_id: ownerId, body: "Check the horn bolt", revision: 1 })
      .returning("id");
    await allOrNothing("PATCH", `${L()}/comments/${c.id}`, { body: "Edited" });
    await allOrNothing("PATCH", `${L()}/comments/${c.id}`, { resolved: true });
    // Both at once: the edit's event goes in, the resolution's is refused, and the edit is undone with it.
    await allOrNothing("PATCH", `${L()}/comments/${c.id}`, { body: "Edited and resolved", resolved: true }, "comment.resolve");
    expect(await testDb("comments").where({ id: c.id }).first()).toMatchObject({ body: "Check the horn bolt", resolved_at: null, edited_at: null });
  });

  it("build records: a log entry deleted, a hardware state, a checklist tick", async () => {
    const [e] = await testDb("log_entries").insert({ build_id: buildId, date: "2026-11-29", hours: 1.5, title: "Fixture entry", systems: ["pitch"] }).returning("id");
    await allOrNothing("DELETE", `${B()}/log/${e.id}`);
    await allOrNothing("PUT", `${B()}/hardware`, { key: "jamNut|1/4-28|RH", state: "ordered" });
    await allOrNothing("PUT", `${L()}/checklist`, { revision: 1, jointId: "j-stick-fwd", code: "jam-nut", ticked: true, note: "marked" });
  });

  it("a build and its members", async () => {
    await allOrNothing("PATCH", B(), { name: "Renamed build" });
    await allOrNothing("POST", `${B()}/members`, { email: other.email, role: "viewer" });
    await allOrNothing("POST", `${B()}/members`, { email: `new-${randomUUID().slice(0, 6)}@tests.linkwright.test`, role: "viewer" });
    await allOrNothing("POST", `${B()}/linkages`, { name: `Roll ${randomUUID().slice(0, 4)}`, system: "roll" });
  });

  it("a file deleted keeps its row and its objects", async () => {
    const fileId = await fixtureFile(buildId, ownerId);
    await allOrNothing("DELETE", `${B()}/files/${fileId}`);
    const res = await owner.request("GET", `${B()}/files/${fileId}`);
    expect(res.status).toBe(200);
  });

  it("a site admin's change to another account", async () => {
    await allOrNothing("PATCH", `/api/admin/users/${other.id}`, { isSiteAdmin: true });
    expect((await testDb("users").where({ id: other.id }).first()).is_site_admin).toBe(false);
  });

  it("with the audit insert working again, the same writes go through and are recorded", async () => {
    const res = await owner.request("PATCH", L(), { name: "Renamed run" });
    expect(res.status).toBe(200);
    const ev = await testDb("audit_events").where({ build_id: buildId, action: "linkage.update" }).orderBy("created_at", "desc").first();
    expect(ev.detail).toMatchObject({ linkageId, name: "Renamed run" });
  });
});
