/**
 * Review and sign-off on the real server and database: who may do what, edit window, resolve/reopen,
 * acknowledgements that lapse when the subject's hardware changes, sign-off refused while a hazard is
 * unacknowledged, sign-offs going stale on a later revision, and the diff of a known pair of revisions.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { demoPitchLinkage, DEMO_WRONG_JOINT } from "@/shared/demo";
import type { LinkageGraph } from "@/shared/linkage/schema";

type Who = "owner" | "builder" | "reviewer" | "viewer" | "outsider";
const c = {} as Record<Who, Client>;
const u = {} as Record<Who, { id: string; email: string; name: string }>;
let buildId: string;
let linkageId: string;
const L = () => `/api/builds/${buildId}/linkages/${linkageId}`;
const WRONG = { type: "joint", id: DEMO_WRONG_JOINT } as const;

async function save(who: Who, graph: LinkageGraph) {
  const cur = await c.owner.request("GET", `${L()}/graph`);
  const res = await c[who].request("PUT", `${L()}/graph`, { baseRevision: cur.body.revision, graph });
  return res;
}
const clone = (g: LinkageGraph): LinkageGraph => JSON.parse(JSON.stringify(g));
const joint = (g: LinkageGraph, id: string) => g.joints.find((j) => j.id === id)!;

beforeAll(async () => {
  for (const w of ["owner", "builder", "reviewer", "viewer", "outsider"] as Who[]) {
    u[w] = await makeUser(w);
    c[w] = await signIn(u[w].email);
  }
  ({ buildId, linkageId } = await makeBuild({ owner: u.owner, builder: u.builder, reviewer: u.reviewer, viewer: u.viewer }));
  const r = await save("builder", demoPitchLinkage()); // revision 2: the demo run with its wrong joint
  expect(r.status).toBe(200);
});
afterAll(() => testDb.destroy());

describe("comments", () => {
  let rootId: string;
  it("builder and reviewer write; viewer reads only; outsiders see nothing", async () => {
    const a = await c.builder.request("POST", `${L()}/comments`, { subject: WRONG, body: "Is this washer big enough?\nSee https://example.test/washers" });
    expect(a.status).toBe(201);
    expect(a.body.comment).toMatchObject({ subject: WRONG, parentId: null, revision: 2, author: { id: u.builder.id }, resolvedAt: null });
    rootId = a.body.comment.id;
    const r = await c.reviewer.request("POST", `${L()}/comments`, { subject: { type: "linkage", id: "ignored" }, body: "x", parentId: rootId });
    expect(r.status).toBe(201);
    expect(r.body.comment).toMatchObject({ parentId: rootId, subject: WRONG }); // a reply takes its thread's subject
    const rr = await c.owner.request("POST", `${L()}/comments`, { subject: WRONG, body: "reply to the reply", parentId: r.body.comment.id });
    expect(rr.body.comment.parentId).toBe(rootId); // one level deep

    expect((await c.viewer.request("POST", `${L()}/comments`, { subject: WRONG, body: "can I?" })).status).toBe(403);
    const list = await c.viewer.request("GET", `${L()}/comments?subjectType=joint&subjectId=${DEMO_WRONG_JOINT}`);
    expect(list.status).toBe(200);
    expect(list.body.comments.map((x: { body: string }) => x.body)).toEqual(["Is this washer big enough?\nSee https://example.test/washers", "x", "reply to the reply"]);
    expect(list.body.unresolved).toEqual({ [`joint:${DEMO_WRONG_JOINT}`]: 1 });
    expect(list.body.unresolvedNames).toEqual({ [`joint:${DEMO_WRONG_JOINT}`]: "Aft pushrod B ↔ Elevator horn, attach" }); // names, not ids
    expect((await c.outsider.request("GET", `${L()}/comments`)).status).toBe(404);
  });

  it("a comment on a node or joint that is not in the current revision is refused", async () => {
    const r = await c.builder.request("POST", `${L()}/comments`, { subject: { type: "node", id: "no-such-part" }, body: "?" });
    expect(r.status).toBe(400);
    expect(r.body.error.fields["subject.id"]).toMatch(/no-such-part/);
  });

  it("the author may edit for 15 minutes; nobody else may", async () => {
    const mine = await c.builder.request("PATCH", `${L()}/comments/${rootId}`, { body: "Is this washer large enough?" });
    expect(mine.status).toBe(200);
    expect(mine.body.comment.body).toBe("Is this washer large enough?");
    expect(mine.body.comment.editedAt).toBeTypeOf("string");
    const theirs = await c.reviewer.request("PATCH", `${L()}/comments/${rootId}`, { body: "rewritten" });
    expect(theirs.status).toBe(403);
    await testDb("comments").where({ id: rootId }).update({ created_at: testDb.raw("now() - interval '16 minutes'") });
    const late = await c.builder.request("PATCH", `${L()}/comments/${rootId}`, { body: "too late" });
    expect(late.status).toBe(403);
    expect(late.body.error.code).toBe("edit_window_closed");
    expect((await testDb("comments").where({ id: rootId }).first()).body).toBe("Is this washer large enough?");
  });

  it("anyone who may comment resolves and reopens a thread; a viewer may not", async () => {
    expect((await c.viewer.request("PATCH", `${L()}/comments/${rootId}`, { resolved: true })).status).toBe(403);
    const res = await c.reviewer.request("PATCH", `${L()}/comments/${rootId}`, { resolved: true });
    expect(res.status).toBe(200);
    expect(res.body.thread).toMatchObject({ id: rootId, resolvedBy: { id: u.reviewer.id } });
    expect((await c.viewer.request("GET", `${L()}/comments`)).body.unresolved).toEqual({});
    const re = await c.builder.request("PATCH", `${L()}/comments/${rootId}`, { resolved: false });
    expect(re.body.thread.resolvedAt).toBeNull();
    expect((await c.viewer.request("GET", `${L()}/comments`)).body.unresolved).toEqual({ [`joint:${DEMO_WRONG_JOINT}`]: 1 });
  });
});

describe("acknowledgements and sign-off", () => {
  it("only a reviewer signs off, only a reviewer or the owner acknowledges, and the reviewer cannot edit the graph", async () => {
    const body = { revision: 2, statement: "Inspected." };
    expect((await c.owner.request("POST", `${L()}/signoffs`, body)).status).toBe(403);
    expect((await c.builder.request("POST", `${L()}/signoffs`, body)).status).toBe(403);
    expect((await c.viewer.request("POST", `${L()}/signoffs`, body)).status).toBe(403);
    const ack = { code: "jam-nut-missing", subject: WRONG, reason: "because" };
    expect((await c.builder.request("POST", `${L()}/acknowledgements`, ack)).status).toBe(403);
    expect((await c.viewer.request("POST", `${L()}/acknowledgements`, ack)).status).toBe(403);
    expect((await save("reviewer", demoPitchLinkage())).status).toBe(403);
    expect(await testDb("finding_acknowledgements").where({ linkage_id: linkageId })).toHaveLength(0);
  });

  it("refuses a sign-off while hazards are unacknowledged, with the list", async () => {
    const r = await c.reviewer.request("POST", `${L()}/signoffs`, { revision: 2, statement: "Looks right." });
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe("unacknowledged_hazards");
    const codes = r.body.error.hazards.map((h: { code: string; subject: { id: string } }) => `${h.code}@${h.subject.id}`).sort();
    expect(codes).toEqual([`jam-nut-missing@${DEMO_WRONG_JOINT}`, `retaining-washer-small@${DEMO_WRONG_JOINT}`]);

    const a1 = await c.reviewer.request("POST", `${L()}/acknowledgements`, { code: "jam-nut-missing", subject: WRONG, reason: "Rod end is safety-wired to the horn instead; photo 3." });
    expect(a1.status).toBe(201);
    const still = await c.reviewer.request("POST", `${L()}/signoffs`, { revision: 2, statement: "Looks right." });
    expect(still.status).toBe(409);
    expect(still.body.error.hazards.map((h: { code: string }) => h.code)).toEqual(["retaining-washer-small"]);

    const a2 = await c.owner.request("POST", `${L()}/acknowledgements`, { code: "retaining-washer-small", subject: WRONG, reason: "Designer's drawing shows an AN970 under the head; fitting it next." });
    expect(a2.status).toBe(201);
    const ok = await c.reviewer.request("POST", `${L()}/signoffs`, { revision: 2, statement: "Revision 2 inspected joint by joint." });
    expect(ok.status).toBe(201);
    expect(ok.body.signoff).toMatchObject({ revision: 2, reviewer: { id: u.reviewer.id }, stale: false });
    const s = await c.viewer.request("GET", `${L()}/signoffs`);
    expect(s.body.status.state).toBe("signed");
  });

  it("a later revision marks the sign-off stale; an old revision cannot be signed", async () => {
    // A change on another joint and a note on the wrong joint: the acknowledgements still hold.
    const g = clone(demoPitchLinkage());
    joint(g, "j-stick-fwd").hardware.torque = 65;
    joint(g, DEMO_WRONG_JOINT).hardware.note = "washer on order";
    expect((await save("builder", g)).status).toBe(200); // revision 3
    const s = await c.viewer.request("GET", `${L()}/signoffs`);
    expect(s.body.currentRevision).toBe(3);
    expect(s.body.status.state).toBe("stale");
    expect(s.body.signoffs[0]).toMatchObject({ revision: 2, stale: true });
    const old = await c.reviewer.request("POST", `${L()}/signoffs`, { revision: 2, statement: "again" });
    expect(old.status).toBe(409);
    expect(old.body.error.code).toBe("not_current");
    const acks = await c.viewer.request("GET", `${L()}/acknowledgements`);
    expect(acks.body.acknowledgements.map((a: { status: string }) => a.status)).toEqual(["active", "active"]);
    const again = await c.reviewer.request("POST", `${L()}/signoffs`, { revision: 3, statement: "Revision 3 checked." });
    expect(again.status).toBe(201);
    expect((await c.viewer.request("GET", `${L()}/signoffs`)).body.status.state).toBe("signed");
  });

  it("an acknowledgement lapses when its joint's hardware changes", async () => {
    const g = clone(demoPitchLinkage());
    joint(g, "j-stick-fwd").hardware.torque = 65;
    joint(g, DEMO_WRONG_JOINT).hardware.torque = 70; // still no jam nut, still a small washer
    expect((await save("builder", g)).status).toBe(200); // revision 4
    const acks = await c.viewer.request("GET", `${L()}/acknowledgements`);
    expect(acks.body.revision).toBe(4);
    expect(acks.body.acknowledgements.map((a: { status: string }) => a.status)).toEqual(["lapsed", "lapsed"]);
    const jam = acks.body.findings.find((f: { code: string }) => f.code === "jam-nut-missing");
    expect(jam.acknowledgement).toBeNull();
    expect(jam.lapsed.reason).toMatch(/safety-wired/);
    const r = await c.reviewer.request("POST", `${L()}/signoffs`, { revision: 4, statement: "?" });
    expect(r.status).toBe(409);
    expect(r.body.error.hazards).toHaveLength(2);
    expect(r.body.error.hazards.every((h: { lapsed: boolean }) => h.lapsed)).toBe(true);
  });

  it("fixing the hardware clears the hazards and the reviewer signs the fixed revision", async () => {
    const g = clone(demoPitchLinkage());
    const h = joint(g, DEMO_WRONG_JOINT).hardware;
    h.jamNut = { fitted: true, tightened: true };
    h.washerUnderHead = { outsideDiameter: 0.625, thickness: 0.063 };
    expect((await save("builder", g)).status).toBe(200); // revision 5
    const r = await c.reviewer.request("POST", `${L()}/signoffs`, { revision: 5, statement: "Fixed joint inspected." });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
  });
});

describe("revision history and diff", () => {
  it("lists revisions with author and time, newest first", async () => {
    const r = await c.viewer.request("GET", `${L()}/revisions`);
    expect(r.status).toBe(200);
    expect(r.body.revisions.map((x: { revision: number }) => x.revision)).toEqual([5, 4, 3, 2, 1]);
    expect([r.body.total, r.body.nextCursor]).toEqual([5, null]);
    const paged = await c.viewer.request("GET", `${L()}/revisions?limit=2`);
    expect(paged.body.revisions.map((x: { revision: number }) => x.revision)).toEqual([5, 4]);
    const next = await c.viewer.request("GET", `${L()}/revisions?limit=2&cursor=${paged.body.nextCursor}`);
    expect(next.body.revisions.map((x: { revision: number }) => x.revision)).toEqual([3, 2]);
    expect(r.body.revisions[0]).toMatchObject({ author: { id: u.builder.id, name: u.builder.name } });
    expect(Date.parse(r.body.revisions[0].createdAt)).toBeGreaterThan(0);
  });

  it("gives the changed hardware fields of revisions 2 → 5 with old and new values", async () => {
    const r = await c.viewer.request("GET", `${L()}/diff?from=2&to=5`);
    expect(r.status).toBe(200);
    const d = r.body.diff;
    expect(d.nodes).toMatchObject({ added: [], removed: [], changed: [] });
    expect(d.joints.added).toEqual([]);
    expect(d.joints.removed).toEqual([]);
    expect(d.joints.changed).toHaveLength(1);
    expect(d.joints.changed[0].id).toBe(DEMO_WRONG_JOINT);
    expect(d.joints.changed[0].fields).toEqual([
      { path: "hardware.jamNut.fitted", after: true },
      { path: "hardware.jamNut.tightened", after: true },
      { path: "hardware.washerUnderHead.outsideDiameter", before: 0.438, after: 0.625 },
    ]);
  });

  it("counts parts added from the empty revision 1 and refuses a revision that does not exist", async () => {
    const r = await c.viewer.request("GET", `${L()}/diff?from=1&to=2`);
    expect(r.body.diff.nodes.added).toHaveLength(demoPitchLinkage().nodes.length);
    expect(r.body.diff.joints.added.map((j: { id: string }) => j.id)).toContain(DEMO_WRONG_JOINT);
    expect((await c.viewer.request("GET", `${L()}/diff?from=1&to=99`)).status).toBe(404);
    expect((await c.viewer.request("GET", `${L()}/diff?from=abc`)).status).toBe(404);
  });
});
