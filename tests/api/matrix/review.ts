import { testDb } from "../../support/db";
import { addRevision } from "../../support/review";
import { demoPitchLinkage } from "@/shared/demo";
import { comment, read, signedIn, type Ctx, type BadInput, type Row } from "./types";

const L = (c: Ctx) => `/api/builds/${c.buildId}/linkages/${c.linkageId}`;
const acknowledge = (ok: number) => ({ owner: ok, builder: 403, reviewer: ok, viewer: 403, outsider: 404, anon: 401 });
const signOff = (ok: number) => ({ owner: 403, builder: 403, reviewer: ok, viewer: 403, outsider: 404, anon: 401 });

async function aComment(c: Ctx) {
  const [row] = await testDb("comments")
    .insert({ build_id: c.buildId, linkage_id: c.linkageId, subject_type: "linkage", subject_id: c.linkageId, author_id: c.users.owner.id, body: "Check the horn bolt", revision: 1 })
    .returning("id");
  return { commentId: row.id as string };
}
async function demoRevision(c: Ctx) {
  await addRevision(c.linkageId, demoPitchLinkage(), c.users.owner.id);
  return {};
}
async function anAck(c: Ctx) {
  const [row] = await testDb("finding_acknowledgements")
    .insert({ linkage_id: c.linkageId, code: "jam-nut-missing", subject_type: "joint", subject_id: "j-aft-horn", reason: "test", user_id: c.users.reviewer.id, revision: 1, fingerprint: "0" })
    .returning("id");
  return { ackId: row.id as string };
}

// prettier-ignore
export const rows: Record<string, Row> = {
  "GET /api/builds/[buildId]/linkages/[linkageId]/comments":                 { expect: read, path: (c) => `${L(c)}/comments` },
  "POST /api/builds/[buildId]/linkages/[linkageId]/comments":                { expect: comment(201), path: (c) => `${L(c)}/comments`, body: (c) => ({ subject: { type: "linkage", id: c.linkageId }, body: "Looks tidy so far." }) },
  "PATCH /api/builds/[buildId]/linkages/[linkageId]/comments/[commentId]":   { expect: comment(200), prepare: aComment, path: (c) => `${L(c)}/comments/${c.x.commentId}`, body: () => ({ resolved: true }) },
  "GET /api/builds/[buildId]/linkages/[linkageId]/acknowledgements":         { expect: read, path: (c) => `${L(c)}/acknowledgements` },
  "POST /api/builds/[buildId]/linkages/[linkageId]/acknowledgements":        { expect: acknowledge(201), prepare: demoRevision, path: (c) => `${L(c)}/acknowledgements`, body: () => ({ code: "jam-nut-missing", subject: { type: "joint", id: "j-aft-horn" }, reason: "Safety-wired instead; see photo." }) },
  "DELETE /api/builds/[buildId]/linkages/[linkageId]/acknowledgements/[ackId]": { expect: acknowledge(200), prepare: anAck, path: (c) => `${L(c)}/acknowledgements/${c.x.ackId}` },
  "GET /api/builds/[buildId]/linkages/[linkageId]/signoffs":                 { expect: read, path: (c) => `${L(c)}/signoffs` },
  "POST /api/builds/[buildId]/linkages/[linkageId]/signoffs":                { expect: signOff(201), path: (c) => `${L(c)}/signoffs`, body: () => ({ revision: 1, statement: "Inspected revision 1; nothing to add." }) },
  "GET /api/builds/[buildId]/linkages/[linkageId]/revisions":                { expect: read, path: (c) => `${L(c)}/revisions` },
  "GET /api/builds/[buildId]/linkages/[linkageId]/diff":                     { expect: read, path: (c) => `${L(c)}/diff?from=1&to=1` },
  "GET /api/me/notifications":                                               { expect: signedIn(200), path: () => "/api/me/notifications" },
  "PATCH /api/me/notifications":                                             { expect: signedIn(200), path: () => "/api/me/notifications", body: () => ({ notify: "all" }) },
};

// prettier-ignore
export const badInput: BadInput = {
  "POST /api/builds/[buildId]/linkages/[linkageId]/comments": {
    path: (c) => `${L(c)}/comments`,
    bodies: [
      [{ subject: { type: "joint", id: "j1" }, body: "" }, "body"],
      [{ subject: { type: "wing", id: "x" }, body: "hello" }, "subject.type"],
      [{ subject: { type: "joint", id: "no-such-joint" }, body: "hello" }, "subject.id"],
      [{ subject: { type: "linkage", id: "x" }, body: "hello", parentId: "not-a-uuid" }, "parentId"],
    ],
  },
  "PATCH /api/builds/[buildId]/linkages/[linkageId]/comments/[commentId]": {
    path: (c) => `${L(c)}/comments/00000000-0000-4000-8000-000000000000`,
    bodies: [[{}, "body"], [{ resolved: "yes" }, "resolved"]],
  },
  "POST /api/builds/[buildId]/linkages/[linkageId]/acknowledgements": {
    path: (c) => `${L(c)}/acknowledgements`,
    bodies: [
      [{ code: "jam-nut-missing", subject: { type: "joint", id: "j1" }, reason: "" }, "reason"],
      [{ code: "no-such-finding", subject: { type: "joint", id: "j1" }, reason: "because" }, "code"],
    ],
  },
  "POST /api/builds/[buildId]/linkages/[linkageId]/signoffs": {
    path: (c) => `${L(c)}/signoffs`,
    bodies: [[{ revision: 1, statement: "" }, "statement"], [{ revision: "one", statement: "ok" }, "revision"], [{ revision: 99, statement: "ok" }, "revision"]],
    as: "reviewer",
  },
  "PATCH /api/me/notifications": { path: () => "/api/me/notifications", bodies: [[{ notify: "sometimes" }, "notify"]] },
};
