/**
 * Every resource answers in the shape its contract in shared/schemas/ describes: the GET answers of a
 * build with a linkage under review, a log entry, an upload and a part are parsed with the response
 * schemas (strictly: a key the contract does not name fails the test).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { makeBuild, makeUser, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { addRevision } from "../support/review";
import { fixtureFile } from "../support/upload";
import { demoPitchLinkage } from "@/shared/demo";
import { buildResponse, buildsResponse } from "@/shared/schemas/builds";
import { invitationsResponse, membersResponse } from "@/shared/schemas/members";
import { diffResponse, linkageResponse, linkagesResponse, revisionsResponse } from "@/shared/schemas/linkages";
import { revision } from "@/shared/schemas/graph";
import { commentsResponse } from "@/shared/schemas/comments";
import { acknowledgementsResponse } from "@/shared/schemas/acknowledgements";
import { signoffsResponse } from "@/shared/schemas/signoffs";
import { logEntryResponse, logResponse } from "@/shared/schemas/log";
import { filesResponse, jointPhotosResponse } from "@/shared/schemas/files";
import { partsResponse } from "@/shared/schemas/parts";
import { checklistResponse } from "@/shared/schemas/checklist";
import { hardwareResponse } from "@/shared/schemas/hardware";
import { notifyResponse, publicUser } from "@/shared/schemas/users";
import { activityResponse } from "@/shared/schemas/activity";
import { exportJobResponse, logEstimateResponse } from "@/shared/schemas/exports";

let owner: Client;
let B = "";
let L = "";

/** The schema with every object strict, so a key the contract does not list is an error. */
function strict(schema: z.ZodType): z.ZodType {
  if (schema instanceof z.ZodObject) return z.strictObject(Object.fromEntries(Object.entries(schema.shape).map(([k, v]) => [k, strict(v as z.ZodType)])));
  if (schema instanceof z.ZodArray) return z.array(strict(schema.element as z.ZodType));
  if (schema instanceof z.ZodNullable) return strict(schema.unwrap() as z.ZodType).nullable();
  if (schema instanceof z.ZodOptional) return strict(schema.unwrap() as z.ZodType).optional();
  return schema;
}

async function fits(path: string, schema: z.ZodType) {
  const res = await owner.request("GET", path);
  expect(res.status, `${path}: ${JSON.stringify(res.body).slice(0, 300)}`).toBe(200);
  const r = strict(schema).safeParse(res.body);
  expect(r.success ? [] : r.error.issues.slice(0, 5), path).toEqual([]);
  return res.body;
}

beforeAll(async () => {
  const [o, r] = await Promise.all([makeUser("contract-owner"), makeUser("contract-reviewer")]);
  const ids = await makeBuild({ owner: o, reviewer: r });
  B = `/api/builds/${ids.buildId}`;
  L = `${B}/linkages/${ids.linkageId}`;
  await addRevision(ids.linkageId, demoPitchLinkage(), o.id);
  const file = await fixtureFile(ids.buildId, o.id);
  await testDb("joint_photos").insert({ linkage_id: ids.linkageId, joint_id: "j-stick-fwd", file_id: file });
  await testDb("comments").insert({ build_id: ids.buildId, linkage_id: ids.linkageId, subject_type: "linkage", subject_id: ids.linkageId, author_id: o.id, body: "Check the horn", revision: 2 });
  await testDb("finding_acknowledgements").insert({ linkage_id: ids.linkageId, code: "jam-nut-missing", subject_type: "joint", subject_id: "j-aft-horn", reason: "test", user_id: r.id, revision: 2, fingerprint: "0" });
  await testDb("signoffs").insert({ linkage_id: ids.linkageId, revision: 1, reviewer_id: r.id, statement: "Revision 1 inspected." });
  await testDb("log_entries").insert({ build_id: ids.buildId, date: "2026-11-29", hours: 1.5, title: "Fitted the horn", systems: ["pitch"], linkage_id: ids.linkageId, revision: 2, author_id: o.id });
  await testDb("parts").insert({ build_id: ids.buildId, kind: "washer", part_number: "AN960-10", description: "washer", spec: JSON.stringify({ insideDiameter: 0.194, outsideDiameter: 0.438 }) });
  owner = await signIn(o.email);
});
afterAll(() => testDb.destroy());

describe("response contracts", () => {
  it("builds, members and invitations", async () => {
    await fits("/api/builds", buildsResponse);
    await fits(B, buildResponse);
    await fits(`${B}/members`, membersResponse);
    await fits(`${B}/invitations`, invitationsResponse);
    await fits("/api/me/notifications", notifyResponse);
    await fits("/api/me", z.object({ user: publicUser }));
  });

  it("linkages, revisions and the graph", async () => {
    await fits(`${B}/linkages`, linkagesResponse);
    await fits(L, linkageResponse);
    await fits(`${L}/graph`, revision);
    await fits(`${L}/revisions`, revisionsResponse);
    await fits(`${L}/diff?from=1&to=2`, diffResponse);
  });

  it("comments, acknowledgements and sign-offs", async () => {
    const c = await fits(`${L}/comments`, commentsResponse);
    expect(c.comments).toHaveLength(1);
    const a = await fits(`${L}/acknowledgements`, acknowledgementsResponse);
    expect(a.acknowledgements).toHaveLength(1);
    const s = await fits(`${L}/signoffs`, signoffsResponse);
    expect(s.signoffs[0].stale).toBe(true);
  });

  it("log, files, joint photos, parts, checklist and hardware", async () => {
    const log = await fits(`${B}/log`, logResponse);
    expect(log.entries).toHaveLength(1);
    await fits(`${B}/log/${log.entries[0].id}`, logEntryResponse);
    expect((await fits(`${B}/files`, filesResponse)).files).toHaveLength(1);
    expect((await fits(`${L}/joints/j-stick-fwd/photos`, jointPhotosResponse)).photos).toHaveLength(1);
    expect((await fits(`${B}/parts`, partsResponse)).parts).toHaveLength(1);
    await fits(`${L}/checklist`, checklistResponse);
    await fits(`${B}/hardware`, hardwareResponse);
    await fits(`${B}/activity`, activityResponse);
  });

  it("exports: the size estimate and a job", async () => {
    await fits(`${B}/log/estimate`, logEstimateResponse);
    const started = await owner.request("POST", `${B}/exports`, { kind: "hardware-csv", params: {} });
    expect(started.status).toBe(202);
    expect(strict(exportJobResponse).safeParse(started.body).success).toBe(true);
    await fits(`${B}/exports/${started.body.job.id}`, exportJobResponse);
  });
});
