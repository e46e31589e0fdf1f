/**
 * The record an inspector keeps of a signed-off revision, and the page that checks one: a reviewer
 * acknowledges the demo's hazards and signs revision 2 off; its record PDF (a job, like every export) holds
 * the fingerprint, every joint's hardware, every finding numbered with its source and acknowledgement, the
 * checklist with who ticked what, the joint photos, the statement and the caution; the public verification
 * route finds the signed revision from the PDF or the typed fingerprint, says "current" until the linkage
 * changes and "superseded" after, and refuses an altered fingerprint or a PDF that is no record.
 */
import { spawnSync } from "node:child_process";
import { mkdirSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PDFDocument } from "pdf-lib";
import { DEMO_WRONG_JOINT, demoPitchLinkage } from "@/shared/demo";
import { CAUTION_TEXT } from "@/shared/caution";
import { jointName } from "@/shared/linkage/names";
import { recordFingerprint } from "@/lib/record-fingerprint";
import { makeBuild, makeUser, snapshot, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { testImage, upload } from "../support/upload";
import { exportFile } from "../support/exports";
import { APP_URL } from "../support/env";
import { addRevision } from "../support/review";

const ARTIFACTS = path.resolve(__dirname, "../artifacts/records");
const WRONG = { type: "joint", id: DEMO_WRONG_JOINT } as const;
let owner: Client, reviewer: Client, viewer: Client, outsider: Client;
let buildId: string, linkageId: string;
const L = () => `/api/builds/${buildId}/linkages/${linkageId}`;
const squash = (s: string) => s.replace(/\s+/g, " ");

function pdfText(bytes: Buffer): string {
  mkdirSync(ARTIFACTS, { recursive: true });
  const f = path.join(ARTIFACTS, `record-${Date.now()}.pdf`);
  writeFileSync(f, bytes);
  const r = spawnSync("/usr/bin/pdftotext", ["-layout", f, "-"], { encoding: "utf8" });
  rmSync(f);
  return r.stdout;
}
const anon = (p: string, body: unknown) => fetch(`${APP_URL}${p}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }).then(async (r) => ({ status: r.status, body: await r.json() }));
const anonPdf = (bytes: Buffer) => {
  const form = new FormData();
  form.set("file", new Blob([new Uint8Array(bytes)], { type: "application/pdf" }), "record.pdf");
  return fetch(`${APP_URL}/api/verify/file`, { method: "POST", body: form }).then(async (r) => ({ status: r.status, body: await r.json() }));
};

beforeAll(async () => {
  const [o, r, v, x] = await Promise.all([makeUser("rr-owner"), makeUser("rr-reviewer"), makeUser("rr-viewer"), makeUser("rr-outsider")]);
  ({ buildId, linkageId } = await makeBuild({ owner: o, reviewer: r, viewer: v }));
  [owner, reviewer, viewer, outsider] = await Promise.all([signIn(o.email), signIn(r.email), signIn(v.email), signIn(x.email)]);
  await addRevision(linkageId, demoPitchLinkage(), o.id); // revision 2: the demo, with its two hazards at the aft pushrod's rod end
});
afterAll(async () => { await testDb.destroy(); });

describe("the record of a signed-off revision", () => {
  let pdf: Buffer;
  let fingerprint: string;

  it("is refused for a revision nobody signed, and made as a job once it is signed off", async () => {
    const early = await owner.request("POST", `/api/builds/${buildId}/exports`, { kind: "revision-record", params: { linkageId, revision: 2 } });
    expect(early.status).toBe(400);
    expect(early.body.error.fields["params.revision"]).toBe("not signed off");

    expect((await reviewer.request("POST", `${L()}/acknowledgements`, { code: "jam-nut-missing", subject: WRONG, reason: "Rod end safety-wired to the horn instead; see the photo." })).status).toBe(201);
    expect((await reviewer.request("POST", `${L()}/acknowledgements`, { code: "retaining-washer-small", subject: WRONG, reason: "Larger washer fitted next, per the designer's drawing." })).status).toBe(201);
    expect((await reviewer.request("PUT", `${L()}/checklist`, { revision: 2, jointId: "j-stick-fwd", code: "jam-nut", ticked: true })).status).toBe(200);
    const photo = await upload(owner, `${L()}/joints/j-stick-fwd/photos`, { bytes: await testImage("jpeg", 640, 480), name: "stick end jam nut.jpg", type: "image/jpeg" });
    expect(photo.status).toBe(201);
    const s = await reviewer.request("POST", `${L()}/signoffs`, { revision: 2, statement: "Inspected the pitch run at the aircraft; hardware as recorded." });
    expect(s.status).toBe(201);
    fingerprint = s.body.signoff.fingerprint;
    expect(fingerprint).toMatch(/^[0-9a-f]{64}$/);

    // The fingerprint is SHA-256 over what was signed: recomputed here from the stored rows, it is the same.
    const row = await testDb("signoffs").where({ linkage_id: linkageId, revision: 2 }).first();
    const rev = await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 2 }).first("graph");
    expect(recordFingerprint({ buildId, linkageId, revision: 2, graph: rev.graph, signoff: { id: row.id, reviewerId: row.reviewer_id, statement: row.statement, signedAt: new Date(row.created_at).toISOString() } })).toBe(fingerprint);

    const made = await exportFile(viewer, buildId, "revision-record", { linkageId, revision: 2 });
    expect(made.headers.get("content-type")).toBe("application/pdf");
    pdf = made.bytes;
    mkdirSync(ARTIFACTS, { recursive: true });
    writeFileSync(path.join(ARTIFACTS, "revision-record.pdf"), pdf);
  }, 120_000);

  it("holds the fingerprint, the hardware, numbered findings with sources and acknowledgements, the checklist, photos, the statement and the caution", async () => {
    const text = squash(pdfText(pdf));
    expect(text).toContain("Revision record — Pitch run, revision 2");
    expect(text).toContain(fingerprint.match(/.{4}/g)!.join(" "));
    expect(text).toContain("This is the linkage's current revision.");
    // every joint of the revision, by name, with its hardware
    const g = demoPitchLinkage();
    for (const j of g.joints) expect(text).toContain(jointName(j, g.nodes));
    expect(text).toMatch(/Rod end 1\/4-28/); // a rod end line from the demo's hardware
    expect(text).toMatch(/1\. Hazard — Jam nut missing — Aft pushrod B ↔ Elevator horn, attach/);
    expect(text).toMatch(/Source: published — AC 43\.13-1B/);
    expect(text).toContain("Acknowledged by Test rr-reviewer");
    expect(text).toContain("Rod end safety-wired to the horn instead");
    expect(text).toMatch(/1 of \d+ items ticked/);
    expect(text).toContain("Ticked by Test rr-reviewer");
    expect(text).toContain("stick end jam nut.jpg");
    expect(text).toContain("Inspected the pitch run at the aircraft; hardware as recorded.");
    expect(text).toContain(squash(CAUTION_TEXT));
    expect(text).not.toMatch(/jam-nut-missing|j-aft-horn/); // names, not codes
    const images = spawnSync("/usr/bin/pdfimages", ["-list", "-"], { input: pdf, encoding: "utf8" });
    expect(images.stdout.trim().split("\n").length).toBeGreaterThanOrEqual(3); // header lines + the photo
    const doc = await PDFDocument.load(pdf);
    expect(doc.getKeywords()).toContain(fingerprint);
  });

  it("is checked on the public verification route from the PDF or the typed fingerprint: current, then superseded", async () => {
    const before = await snapshot();
    const byFile = await anonPdf(pdf);
    expect(byFile.status).toBe(200);
    expect(byFile.body).toMatchObject({ match: true, record: { linkageName: "Pitch run", revision: 2, signedBy: "Test rr-reviewer", current: true } });
    const typed = await anon("/api/verify", { fingerprint: fingerprint.toUpperCase().match(/.{4}/g)!.join(" ") });
    expect(typed.body).toMatchObject({ fingerprint, match: true });
    expect(await snapshot()).toEqual(before); // nothing is kept

    await addRevision(linkageId, { ...demoPitchLinkage(), name: "Pitch run, changed" });
    const later = await anon("/api/verify", { fingerprint });
    expect(later.body.record).toMatchObject({ current: false, currentRevision: 3, revision: 2 });
    // the record made now says so on its first page
    const again = await exportFile(viewer, buildId, "revision-record", { linkageId, revision: 2 });
    expect(squash(pdfText(again.bytes))).toContain("Superseded: the linkage has since changed (revision 3 is current)");
  }, 120_000);

  it("says no for an altered fingerprint, and refuses what is not a fingerprint or not a record", async () => {
    const altered = fingerprint.slice(0, 63) + (fingerprint.endsWith("0") ? "1" : "0");
    expect((await anon("/api/verify", { fingerprint: altered })).body).toMatchObject({ match: false, record: null });
    const bad = await anon("/api/verify", { fingerprint: "not a fingerprint" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.fingerprint).toMatch(/64 hexadecimal digits/);
    expect((await anon("/api/verify", {})).status).toBe(400);
    const other = await PDFDocument.create();
    other.addPage();
    const notRecord = await anonPdf(Buffer.from(await other.save()));
    expect(notRecord.status).toBe(400);
    expect(notRecord.body.error.fields.file).toMatch(/no revision-record fingerprint/);
    expect((await anonPdf(Buffer.from("plain text, not a PDF"))).status).toBe(400);
  });

  it("is made only for members of the build", async () => {
    expect((await outsider.request("POST", `/api/builds/${buildId}/exports`, { kind: "revision-record", params: { linkageId, revision: 2 } })).status).toBe(404);
    const bogus = await owner.request("POST", `/api/builds/${buildId}/exports`, { kind: "revision-record", params: { linkageId } });
    expect(bogus.status).toBe(400);
    expect(bogus.body.error.fields["params.revision"]).toBe("revision is required");
  });
});
