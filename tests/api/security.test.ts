/**
 * Security review regressions on the real server and database: input that used to reach Postgres and
 * come back as a 500 (revision numbers past int4, year 0, loose build ids, NUL characters), a log
 * entry's revision checked against its linkage on every change, the last owner kept under concurrent
 * removals, and ids of another build refused everywhere a route takes one.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { demoPitchLinkage } from "@/shared/demo";
import { analyze } from "@/shared/analysis";
import { makeBuild, makeUser, snapshot, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { fixtureFile } from "../support/upload";

let owner: Client, reviewer: Client, outsider: Client;
let ownerId: string, outsiderId: string;
let buildId: string, linkageId: string, jointId: string;
/** Another build (of the outsider) whose ids are tried through the first build's URLs. */
let other: { buildId: string; linkageId: string; invitationId: string; fileId: string; commentId: string; entryId: string; partId: string; personalPartId: string; ackId: string };
const B = () => `/api/builds/${buildId}`;
const L = () => `${B()}/linkages/${linkageId}`;
const TOO_BIG = 99_999_999_999; // past Postgres' integer (2,147,483,647)

beforeAll(async () => {
  const [o, r, x] = await Promise.all([makeUser("sec-owner"), makeUser("sec-reviewer"), makeUser("sec-outsider")]);
  ownerId = o.id;
  outsiderId = x.id;
  ({ buildId, linkageId } = await makeBuild({ owner: o, reviewer: r }));
  const graph = demoPitchLinkage();
  jointId = graph.joints[0].id;
  await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 }).update({ graph: JSON.stringify(graph), analysis: JSON.stringify(analyze(graph)) });
  [owner, reviewer, outsider] = await Promise.all([signIn(o.email), signIn(r.email), signIn(x.email)]);

  const ob = await makeBuild({ owner: x });
  const fileId = await fixtureFile(ob.buildId, x.id);
  const [comment] = await testDb("comments").insert({ build_id: ob.buildId, linkage_id: ob.linkageId, subject_type: "linkage", subject_id: ob.linkageId, author_id: x.id, body: "theirs", revision: 1 }).returning("id");
  const [entry] = await testDb("log_entries").insert({ build_id: ob.buildId, date: "2024-01-01", hours: 1, title: "theirs", text: "", systems: [], author_id: x.id }).returning("id");
  const [part] = await testDb("parts").insert({ build_id: ob.buildId, kind: "washer", part_number: "AN960-10", description: "theirs", spec: JSON.stringify({ insideDiameter: 0.194, outsideDiameter: 0.438 }) }).returning("id");
  const [personal] = await testDb("parts").insert({ owner_user_id: x.id, kind: "washer", part_number: "AN960-10", description: "mine", spec: JSON.stringify({ insideDiameter: 0.194, outsideDiameter: 0.438 }) }).returning("id");
  const [ack] = await testDb("finding_acknowledgements").insert({ linkage_id: ob.linkageId, code: "x", subject_type: "linkage", subject_id: ob.linkageId, reason: "theirs", user_id: x.id, revision: 1, fingerprint: "f" }).returning("id");
  other = { ...ob, fileId, commentId: comment.id, entryId: entry.id, partId: part.id, personalPartId: personal.id, ackId: ack.id };
});
afterAll(() => testDb.destroy());

/** Sends the request and expects the status with nothing changed in any table. */
async function refused(c: Client, method: string, path: string, status: number, body?: unknown) {
  const before = await snapshot();
  const res = await c.request(method, path, body);
  expect(res.status, `${method} ${path}: ${JSON.stringify(res.body)}`).toBe(status);
  expect(await snapshot()).toEqual(before);
  return res;
}

describe("numbers and dates Postgres cannot hold", () => {
  it("a revision number past int4 in a query is a 404, not a 500", async () => {
    for (const q of [`graph?revision=${TOO_BIG}`, `graph?revision=2147483648`, `file?revision=${TOO_BIG}`, `checklist?revision=${TOO_BIG}`, `diff?from=${TOO_BIG}`, `diff?from=1&to=${TOO_BIG}`]) {
      await refused(owner, "GET", `${L()}/${q}`, 404);
    }
  });

  it("a revision number past int4 in a body is a 400 naming it", async () => {
    const graph = (await owner.request("GET", `${L()}/graph`)).body.graph;
    expect((await refused(owner, "PUT", `${L()}/graph`, 400, { baseRevision: TOO_BIG, graph })).body.error.fields).toHaveProperty("baseRevision");
    expect((await refused(owner, "PUT", `${L()}/checklist`, 400, { revision: TOO_BIG, jointId, code: "cotter-pin", ticked: true })).body.error.fields).toHaveProperty("revision");
    expect((await refused(owner, "POST", `${B()}/log`, 400, { date: "2024-01-01", hours: 1, title: "t", linkageId, revision: TOO_BIG })).body.error.fields).toHaveProperty("revision");
    const entry = (await owner.request("POST", `${B()}/log`, { date: "2024-01-01", hours: 1, title: "big revision" })).body.entry;
    expect((await refused(owner, "PATCH", `${B()}/log/${entry.id}`, 400, { revision: TOO_BIG })).body.error.fields).toHaveProperty("revision");
  });

  it("the year 0000 (no such year in Postgres) is refused as a date", async () => {
    expect((await refused(owner, "GET", `${B()}/log?from=0000-01-01`, 400)).body.error.fields).toHaveProperty("from");
    await refused(owner, "GET", `${B()}/log/estimate?to=0000-12-31`, 400);
    expect((await refused(owner, "POST", `${B()}/exports`, 400, { kind: "log-pdf", params: { to: "0000-12-31" } })).body.error.fields).toHaveProperty("params.to");
    expect((await refused(owner, "POST", `${B()}/log`, 400, { date: "0000-01-01", hours: 1, title: "t" })).body.error.fields).toHaveProperty("date");
    const entry = (await owner.request("POST", `${B()}/log`, { date: "2024-01-01", hours: 1, title: "year zero" })).body.entry;
    await refused(owner, "PATCH", `${B()}/log/${entry.id}`, 400, { date: "0000-01-01" });
    expect((await owner.request("GET", `${B()}/log?from=0001-01-01`)).status).toBe(200);
  });

  it("a build or linkage id that only looks like a uuid is a 404 on routes and pages", async () => {
    for (const id of ["a".repeat(36), "-".repeat(36), "0123456789abcdef0123456789abcdef-123"]) {
      await refused(owner, "GET", `/api/builds/${id}`, 404);
      await refused(owner, "GET", `/api/builds/${id}/linkages`, 404);
      expect((await owner.request("GET", `/builds/${id}`)).status).toBe(404);
      expect((await owner.request("GET", `/builds/${buildId}/linkages/${id}`)).status).toBe(404);
      expect((await owner.request("GET", `/builds/${buildId}/checklist/${id}`)).status).toBe(404);
    }
  });
});

describe("NUL characters (Postgres text and jsonb cannot store U+0000)", () => {
  it("are a 400 naming the field in every kind of body, and change nothing", async () => {
    const graph = (await owner.request("GET", `${L()}/graph`)).body.graph;
    graph.nodes[0].label = "a\u0000b";
    const cases: [Client, string, string, unknown, string][] = [
      [reviewer, "POST", `${L()}/comments`, { subject: { type: "linkage", id: linkageId }, body: "a\u0000b" }, "body"],
      [owner, "POST", `${B()}/log`, { date: "2024-01-01", hours: 1, title: "a\u0000b" }, "title"],
      [owner, "POST", "/api/builds", { name: "a\u0000b" }, "name"],
      [owner, "PATCH", L(), { name: "a\u0000b" }, "name"],
      [owner, "PUT", `${L()}/graph`, { baseRevision: 1, graph }, "graph.nodes.0.label"],
      [owner, "PUT", `${L()}/checklist`, { revision: 1, jointId, code: "cotter-pin", ticked: true, note: "a\u0000" }, "note"],
      [owner, "POST", "/api/parts", { kind: "washer", partNumber: "AN960-8", description: "a\u0000", spec: { insideDiameter: 0.17, outsideDiameter: 0.375 } }, "description"],
    ];
    for (const [c, method, path, body, field] of cases) {
      const res = await refused(c, method, path, 400, body);
      expect(res.body.error.code).toBe("invalid_input");
      expect(Object.keys(res.body.error.fields)).toContain(field);
    }
    const before = await snapshot();
    const res = await owner.request("POST", "/api/sign-up", { name: "a\u0000b", email: `nul-${randomUUID().slice(0, 6)}@tests.linkwright.test`, password: "long enough password" });
    expect(res.status).toBe(400);
    expect(await snapshot()).toEqual(before);
  });

  it("are a 4xx in query strings too", async () => {
    expect((await refused(owner, "GET", `${B()}/log?q=a%00b`, 400)).body.error.fields).toHaveProperty("q");
    await refused(owner, "GET", `${B()}/log/estimate?q=a%00b`, 400);
    await refused(owner, "GET", `${L()}/comments?subjectType=joint&subjectId=a%00b`, 404);
  });

  it("a literal backslash-u in text is still just text", async () => {
    const res = await owner.request("POST", `${B()}/log`, { date: "2024-01-01", hours: 1, title: "escape \\u0000 shown as typed" });
    expect(res.status).toBe(201);
    expect(res.body.entry.title).toBe("escape \\u0000 shown as typed");
  });
});

describe("a log entry's revision belongs to its linkage", () => {
  let second: string;
  beforeAll(async () => {
    const [l] = await testDb("linkages").insert({ build_id: buildId, name: "Roll run", system: "roll", current_revision: 3 }).returning("id");
    second = l.id;
    for (const revision of [1, 2, 3]) await testDb("linkage_revisions").insert({ linkage_id: second, revision, graph: JSON.stringify(demoPitchLinkage()), author_id: ownerId });
  });

  it("a patched revision alone is checked against the entry's stored linkage", async () => {
    const entry = (await owner.request("POST", `${B()}/log`, { date: "2024-01-02", hours: 1, title: "tied", linkageId })).body.entry;
    expect(entry.revision).toBe(1);
    expect((await refused(owner, "PATCH", `${B()}/log/${entry.id}`, 400, { revision: 7 })).body.error.fields).toHaveProperty("revision");
    const ok = await owner.request("PATCH", `${B()}/log/${entry.id}`, { revision: 1 });
    expect(ok.status).toBe(200);
  });

  it("a revision on an entry with no linkage is refused", async () => {
    const entry = (await owner.request("POST", `${B()}/log`, { date: "2024-01-02", hours: 1, title: "loose" })).body.entry;
    await refused(owner, "PATCH", `${B()}/log/${entry.id}`, 400, { revision: 1 });
  });

  it("moving an entry to another linkage without a revision takes that linkage's current revision", async () => {
    const entry = (await owner.request("POST", `${B()}/log`, { date: "2024-01-02", hours: 1, title: "moved", linkageId })).body.entry;
    const moved = await owner.request("PATCH", `${B()}/log/${entry.id}`, { linkageId: second });
    expect(moved.status).toBe(200);
    expect(moved.body.entry).toMatchObject({ linkageId: second, revision: 3 });
    const kept = await owner.request("PATCH", `${B()}/log/${entry.id}`, { linkageId: second, title: "moved again" });
    expect(kept.body.entry).toMatchObject({ linkageId: second, revision: 3 });
    const pinned = await owner.request("PATCH", `${B()}/log/${entry.id}`, { linkageId, revision: 1 });
    expect(pinned.body.entry).toMatchObject({ linkageId, revision: 1 });
  });
});

describe("owners removing or demoting each other at the same moment", () => {
  it("never leave a build without an owner", async () => {
    const [a, b] = await Promise.all([makeUser("co-owner-a"), makeUser("co-owner-b")]);
    const [ca, cb] = await Promise.all([signIn(a.email), signIn(b.email)]);
    for (let i = 0; i < 8; i++) {
      const ids = await makeBuild({ owner: a });
      await testDb("memberships").insert({ build_id: ids.buildId, user_id: b.id, role: "owner" });
      const P = `/api/builds/${ids.buildId}/members`;
      const statuses = await Promise.all(
        i % 2 ? [ca.request("DELETE", `${P}/${b.id}`), cb.request("DELETE", `${P}/${a.id}`)] : [ca.request("PATCH", `${P}/${b.id}`, { role: "viewer" }), cb.request("PATCH", `${P}/${a.id}`, { role: "viewer" })],
      );
      const owners = await testDb("memberships").where({ build_id: ids.buildId, role: "owner" });
      expect(owners.length, JSON.stringify(statuses.map((s) => s.status))).toBe(1);
      // One wins. The other is refused: 409 (it would leave no owner) when both reach the check together, or — when
      // the winner committed first — 404 (removed: no longer a member) or 403 (demoted: a viewer cannot manage).
      const [won, lost] = statuses.map((s) => s.status).sort();
      expect(won).toBe(200);
      expect(i % 2 ? [404, 409] : [403, 409]).toContain(lost);
    }
  });
});

describe("ids of another build, through this build's URLs (a member of both would still be refused)", () => {
  it("are never read, changed or attached", async () => {
    const o = other;
    await refused(owner, "GET", `${B()}/files/${o.fileId}`, 404);
    await refused(owner, "DELETE", `${B()}/files/${o.fileId}`, 404);
    await refused(owner, "GET", `${B()}/log/${o.entryId}`, 404);
    await refused(owner, "PATCH", `${B()}/log/${o.entryId}`, 404, { title: "mine now" });
    await refused(owner, "DELETE", `${B()}/log/${o.entryId}`, 404);
    await refused(owner, "POST", `${B()}/log`, 400, { date: "2024-01-01", hours: 1, title: "t", fileIds: [o.fileId] });
    await refused(owner, "POST", `${B()}/log`, 400, { date: "2024-01-01", hours: 1, title: "t", linkageId: o.linkageId });
    await refused(owner, "GET", `${B()}/linkages/${o.linkageId}`, 404);
    await refused(owner, "PUT", `${B()}/linkages/${o.linkageId}/graph`, 404, { baseRevision: 1, graph: demoPitchLinkage() });
    await refused(owner, "GET", `${B()}/linkages/${o.linkageId}/comments`, 404);
    await refused(owner, "PATCH", `${L()}/comments/${o.commentId}`, 404, { resolved: true });
    await refused(reviewer, "POST", `${L()}/comments`, 400, { subject: { type: "linkage", id: linkageId }, body: "reply", parentId: o.commentId });
    await refused(owner, "DELETE", `${L()}/acknowledgements/${o.ackId}`, 404);
    await refused(owner, "POST", `${L()}/joints/${jointId}/photos`, 400, { fileId: o.fileId });
    await refused(owner, "PUT", `${B()}/parts/${o.partId}`, 404, { kind: "washer", partNumber: "AN960-10", description: "mine now", spec: { insideDiameter: 0.194, outsideDiameter: 0.438 } });
    await refused(owner, "DELETE", `${B()}/parts/${o.partId}`, 404);
    await refused(owner, "DELETE", `${B()}/invitations/${o.invitationId}`, 404);
    await refused(owner, "PATCH", `${B()}/members/${outsiderId}`, 404, { role: "owner" });
  });

  it("a personal parts library is its owner's alone", async () => {
    expect((await owner.request("GET", "/api/parts")).body.parts.map((p: { id: string }) => p.id)).not.toContain(other.personalPartId);
    await refused(owner, "PUT", `/api/parts/${other.personalPartId}`, 404, { kind: "washer", partNumber: "AN960-10", description: "mine now", spec: { insideDiameter: 0.194, outsideDiameter: 0.438 } });
    await refused(owner, "DELETE", `/api/parts/${other.personalPartId}`, 404);
    expect((await outsider.request("GET", "/api/parts")).body.parts.map((p: { id: string }) => p.id)).toContain(other.personalPartId);
  });
});
