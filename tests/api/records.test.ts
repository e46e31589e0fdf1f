/**
 * Build records on the real server, the real database and the real local S3 fake: uploads, the log,
 * parts libraries with CSV, suggestions, the hardware list, the checklist and the PDFs.
 */
import { spawnSync } from "node:child_process";
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPitchLinkage, DEMO_WRONG_JOINT } from "@/shared/demo";
import { checklistFor } from "@/shared/records/checklist";
import { analyze } from "@/shared/analysis";
import { CAUTION_TEXT } from "@/shared/caution";
import { makeBuild, makeUser, snapshot, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { deleteTestObjects, fetchBytes, s3Keys, testImage, upload, uploadRaw } from "../support/upload";
import { APP_URL } from "../support/env";
import { exportFile } from "../support/exports";

const ARTIFACTS = path.resolve(__dirname, "../artifacts/records");
mkdirSync(ARTIFACTS, { recursive: true });

let owner: Client, reviewer: Client, viewer: Client, outsider: Client;
let buildId: string, linkageId: string, ownerId: string;
const B = () => `/api/builds/${buildId}`;
const L = () => `${B()}/linkages/${linkageId}`;

beforeAll(async () => {
  const [o, r, v, x] = await Promise.all([makeUser("rec-owner"), makeUser("rec-reviewer"), makeUser("rec-viewer"), makeUser("rec-outsider")]);
  ownerId = o.id;
  ({ buildId, linkageId } = await makeBuild({ owner: o, reviewer: r, viewer: v }));
  const graph = demoPitchLinkage();
  await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 })
    .update({ graph: JSON.stringify(graph), analysis: JSON.stringify(analyze(graph)) });
  [owner, reviewer, viewer, outsider] = await Promise.all([signIn(o.email), signIn(r.email), signIn(v.email), signIn(x.email)]);
});
afterAll(() => testDb.destroy());

/** Nothing changed: same rows in every table, same objects in the bucket. */
async function state() {
  return { db: await snapshot(), objects: await s3Keys(`builds/${buildId}/`) };
}

describe("uploads", () => {
  it("round-trips a photo through the S3 fake: bytes back to members, a thumbnail, nothing to outsiders", async () => {
    const jpeg = await testImage("jpeg", 1200, 900);
    const res = await upload(owner, `${B()}/files`, { bytes: jpeg, name: "Witness hole, aft end.JPG", type: "text/plain" /* the client's type is ignored */ });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const f = res.body.file;
    expect(f).toMatchObject({ kind: "photo", contentType: "image/jpeg", size: jpeg.length, name: "Witness hole, aft end.jpg", width: 1200, height: 900, hasThumbnail: true });
    const row = await testDb("files").where({ id: f.id }).first();
    expect(await s3Keys(`builds/${buildId}/`)).toEqual(expect.arrayContaining([row.key, row.thumb_key]));

    const back = await fetchBytes(viewer, f.url);
    expect(back.status).toBe(200);
    expect(back.headers.get("content-type")).toBe("image/jpeg");
    expect(back.headers.get("x-content-type-options")).toBe("nosniff");
    expect(back.bytes.equals(jpeg)).toBe(true);

    const thumb = await fetchBytes(reviewer, f.thumbUrl);
    expect(thumb.status).toBe(200);
    const sharp = (await import("sharp")).default;
    const meta = await sharp(thumb.bytes).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(["jpeg", 320, 240]); // 320 px box, aspect kept

    expect((await fetchBytes(outsider, f.url)).status).toBe(404);
    const anon = await fetch(`${APP_URL}${f.url}`);
    expect(anon.status).toBe(401);

    // delete: row and both objects gone
    expect((await owner.request("DELETE", f.url)).status).toBe(200);
    expect(await testDb("files").where({ id: f.id }).first()).toBeUndefined();
    expect(await s3Keys(`builds/${buildId}/`)).not.toEqual(expect.arrayContaining([row.key]));
  });

  it("accepts PNG and WebP by content; PDFs get no thumbnail", async () => {
    for (const fmt of ["png", "webp"] as const) {
      const r = await upload(owner, `${B()}/files`, { bytes: await testImage(fmt, 100, 80), name: `x.${fmt}` });
      expect(r.status).toBe(201);
      expect(r.body.file.contentType).toBe(`image/${fmt}`);
    }
    const pdf = Buffer.from("%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj 2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n");
    const r = await upload(owner, `${B()}/files`, { bytes: pdf, name: "plans page 12.pdf" });
    expect(r.status).toBe(201);
    expect(r.body.file).toMatchObject({ kind: "pdf", contentType: "application/pdf", hasThumbnail: false, thumbUrl: null });
  });

  const rejected: [string, () => Promise<{ bytes: Buffer; name: string; type?: string }>, number, string][] = [
    ["a script named .jpg", async () => ({ bytes: Buffer.from("<script>alert(1)</script>"), name: "photo.jpg", type: "image/jpeg" }), 415, "unsupported_type"],
    ["an HTML file with a PNG name", async () => ({ bytes: Buffer.from("<!doctype html><html><body>hi</body></html>"), name: "a.png", type: "image/png" }), 415, "unsupported_type"],
    ["a GIF (not an accepted format)", async () => ({ bytes: Buffer.from("474946383961010001000000002c00000000010001000002", "hex"), name: "a.gif" }), 415, "unsupported_type"],
    ["a truncated JPEG", async () => ({ bytes: (await testImage("jpeg", 400, 300)).subarray(0, 200), name: "cut.jpg" }), 415, "unreadable_image"],
    ["a photo over 10 MB", async () => ({ bytes: Buffer.concat([await testImage("jpeg", 64, 64), Buffer.alloc(10 * 1024 * 1024)]), name: "big.jpg" }), 413, "too_large"],
    ["a name with ../", async () => ({ bytes: await testImage("jpeg", 64, 64), name: "../../etc/passwd.jpg" }), 400, "invalid_name"],
    ["a name with a backslash path", async () => ({ bytes: await testImage("jpeg", 64, 64), name: "..\\..\\boot.ini.jpg" }), 400, "invalid_name"],
  ];
  for (const [what, make, status, code] of rejected) {
    it(`refuses ${what} and leaves no row and no object behind`, async () => {
      const before = await state();
      const r = await upload(owner, `${B()}/files`, await make());
      expect(r.status, JSON.stringify(r.body)).toBe(status);
      expect(r.body.error.code).toBe(code);
      expect(await state()).toEqual(before);
    });
  }

  it("refuses a PDF over 20 MB, and a PDF where only photos go", async () => {
    const before = await state();
    const big = Buffer.concat([Buffer.from("%PDF-1.4\n"), Buffer.alloc(20 * 1024 * 1024 + 10)]);
    const r = await upload(owner, `${B()}/files`, { bytes: big, name: "huge.pdf" });
    expect(r.status).toBe(413);
    const j = await upload(owner, `${L()}/joints/j-stick-fwd/photos`, { bytes: Buffer.from("%PDF-1.4\n%%EOF\n"), name: "a.pdf" });
    expect(j.status).toBe(415);
    expect(await state()).toEqual(before);
  });

  it("reports what it does with HEIC (sharp's prebuilt libvips reads AVIF but has no HEVC decoder)", async () => {
    const sharp = (await import("sharp")).default;
    expect(sharp.format.heif.input.fileSuffix).toEqual([".avif"]); // measured on sharp 0.35.5: HEIF input is AVIF only
    // A HEIC file starts with an ftyp box naming the heic brand: refused with a message telling how to convert.
    const heic = Buffer.concat([Buffer.from("0000001c6674797068656963000000006d69663168656963", "hex"), Buffer.alloc(64)]);
    const before = await state();
    const r = await upload(owner, `${B()}/files`, { bytes: heic, name: "IMG_0001.HEIC" });
    expect(r.status).toBe(415);
    expect(r.body.error.message).toMatch(/HEIC/);
    expect(await state()).toEqual(before);
  });

  it("attaches a photo to a joint, lists it, and stores the editor's PNG as the revision picture", async () => {
    const r = await upload(owner, `${L()}/joints/j-stick-fwd/photos`, { bytes: await testImage("jpeg", 640, 480), name: "jam nut.jpg" });
    expect(r.status).toBe(201);
    const list = await viewer.request("GET", `${L()}/joints/j-stick-fwd/photos`);
    expect(list.body.photos.map((p: { id: string }) => p.id)).toEqual([r.body.photo.id]);
    expect((await owner.request("GET", `${L()}/joints/no-such-joint/photos`)).status).toBe(404);

    const png = await testImage("png", 320, 200);
    const pic = await uploadRaw(owner, `${L()}/revisions/1/picture`, png, "image/png");
    expect(pic.status).toBe(201);
    expect(pic.body.picture.kind).toBe("linkage-picture");
    const got = await fetchBytes(viewer, `${L()}/revisions/1/picture`);
    expect(got.bytes.equals(png)).toBe(true);
    // a second export replaces the first: one picture per revision, the old object removed
    const again = await uploadRaw(owner, `${L()}/revisions/1/picture`, await testImage("png", 300, 200), "image/png");
    expect(again.status).toBe(201);
    expect(await testDb("files").where({ id: pic.body.picture.id }).first()).toBeUndefined();
    expect(await s3Keys(`builds/${buildId}/files/${pic.body.picture.id}`)).toEqual([]);
    expect((await owner.request("GET", `${L()}/revisions/9/picture`)).status).toBe(404);
  });
});

describe("parts libraries and CSV", () => {
  const csv = [
    "\uFEFFkind;partNumber;description;thread;hand;ballBore;ratedUltimate",
    'rodEnd;T-100;"Rod end; 1/4-28 LH";1/4-28;LH;0,25;4200',
    "rodEnd;T-101;;1/4-28;LH;0.25;lots",
    "rodEnd;T-102;;1/4-27;LH;0.25;6000",
    "rodEnd;T-100;;1/4-28;LH;0.25;6000",
    "rodEnd;T-103;;1/4-28;LH;0.25;6000",
  ].join("\r\n"); // ratings invented for the test, no source

  it("imports nothing while any row fails, with the exact row errors", async () => {
    const before = await snapshot();
    const r = await owner.request("POST", `${B()}/parts/import`, { csv });
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe("csv_rows_invalid");
    expect(r.body.error.report.errors).toEqual([
      { row: 3, partNumber: "T-101", errors: [{ column: "ratedUltimate", message: '"lots" is not a number (lbf)' }] },
      { row: 4, partNumber: "T-102", errors: [{ column: "thread", message: 'unknown thread "1/4-27" (use 10-32, 1/4-28, 5/16-24, 3/8-24, 7/16-20, 1/2-20)' }] },
      { row: 5, partNumber: "T-100", errors: [{ column: "partNumber", message: '"T-100" is a duplicate of row 2' }] },
    ]);
    expect(await snapshot()).toEqual(before);
  });

  it("imports the good rows when asked to skip bad ones, then exports them", async () => {
    const r = await owner.request("POST", `${B()}/parts/import`, { csv, skipBadRows: true });
    expect(r.status).toBe(201);
    expect([r.body.imported, r.body.skipped]).toEqual([2, 3]);
    const parts = (await viewer.request("GET", `${B()}/parts`)).body.parts;
    expect(parts.map((p: { partNumber: string }) => p.partNumber).sort()).toEqual(["T-100", "T-103"]);
    expect(parts.find((p: { partNumber: string }) => p.partNumber === "T-100").description).toBe("Rod end; 1/4-28 LH");
    // importing the same file again: every row is now a duplicate of the library
    const again = await owner.request("POST", `${B()}/parts/import`, { csv: csv.split("\r\n").filter((_, i) => i === 0 || i === 5).join("\n") });
    expect(again.body.error.report.errors).toEqual([{ row: 2, partNumber: "T-103", errors: [{ column: "partNumber", message: '"T-103" is already in this library' }] }]);
    const res = await fetch(`${APP_URL}${B()}/parts/export`, { headers: { cookie: viewer.cookie } });
    expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
    const text = await res.text();
    expect(text.split("\r\n")[0]).toMatch(/^kind,partNumber,description,thread,hand,shank,ballBore/);
    expect(text).toContain("rodEnd,T-100,Rod end; 1/4-28 LH,1/4-28,LH,male,0.25,,,4200,,yes");
  });

  it("keeps personal libraries apart and refuses duplicate part numbers", async () => {
    const p = { kind: "rodEnd", partNumber: "MY-1", spec: { thread: "1/4-28", hand: "LH", ballBore: 0.25, ratedUltimate: 5000 } }; // invented
    expect((await reviewer.request("POST", "/api/parts", p)).status).toBe(201);
    const dup = await reviewer.request("POST", "/api/parts", { ...p, partNumber: "my-1" });
    expect([dup.status, dup.body.error.fields]).toEqual([409, { partNumber: "already in this library" }]);
    expect((await outsider.request("GET", "/api/parts")).body.parts).toEqual([]);
  });

  it("suggests fitting parts from the build's and the caller's libraries, ordered by margin", async () => {
    const r = await reviewer.request("GET", `${L()}/joints/${DEMO_WRONG_JOINT}/suggestions`);
    expect(r.status).toBe(200);
    const required = analyze(demoPitchLinkage()).joints.find((j) => j.jointId === DEMO_WRONG_JOINT)!.radialUltimate;
    expect(r.body.required).toBeCloseTo(required, 6);
    // T-103 6000, MY-1 5000 (reviewer's own), T-100 4200 lbf: all 1/4-28 LH, bore 0.25 in (invented)
    expect(r.body.rodEnds.map((s: { part: { partNumber: string } }) => s.part.partNumber)).toEqual(["T-103", "MY-1", "T-100"]);
    expect(r.body.rodEnds[0].margin).toBeCloseTo(6000 / required - 1, 9);
    expect(r.body.rodEnds[1].part.library).toBe("personal");
  });
});

describe("build log", () => {
  it("creates entries with photos and a linkage revision, filters them and totals the hours", async () => {
    const photo = (await upload(owner, `${B()}/files`, { bytes: await testImage("jpeg", 900, 600), name: "aft pushrod.jpg" })).body.file;
    const e = (body: object) => owner.request("POST", `${B()}/log`, body);
    const a = await e({ date: "2026-10-03", hours: 3.5, title: "Made the aft pushrod", text: "Cut and deburred the 6061 tube; riveted the inserts.", systems: ["pitch"], fileIds: [photo.id], linkageId });
    expect(a.status, JSON.stringify(a.body)).toBe(201);
    expect(a.body.entry).toMatchObject({ revision: 1, linkageName: "Pitch run", files: [{ id: photo.id }] });
    // the entry carries the findings counts stored with that revision
    const stored = (await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 }).first()).analysis.summary;
    expect(a.body.entry.revisionSummary).toEqual({ hazard: stored.hazard, caution: stored.caution, advisory: stored.advisory });
    expect(stored.hazard).toBeGreaterThan(0);
    await e({ date: "2026-10-20", hours: 2, title: "Rudder pedals", systems: ["yaw"] });
    await e({ date: "2026-11-02", hours: 1.25, title: "Torque stripes on the bellcrank", systems: ["pitch", "roll"] });
    const bad = await e({ date: "2026-11-02", hours: 1, title: "x", fileIds: ["00000000-0000-4000-8000-000000000000"] });
    expect([bad.status, bad.body.error.fields]).toEqual([400, { fileIds: "not files of this build" }]);

    const all = (await viewer.request("GET", `${B()}/log`)).body;
    expect(all.entries.map((x: { title: string }) => x.title)).toEqual(["Torque stripes on the bellcrank", "Rudder pedals", "Made the aft pushrod"]);
    expect([all.total, all.nextCursor]).toEqual([3, null]);
    expect(all.totals.total).toBe(6.75);
    expect(all.totals.bySystem).toEqual({ pitch: 4.75, yaw: 2, roll: 1.25 });
    expect(all.totals.byMonth).toEqual([{ month: "2026-10", pitch: 3.5, yaw: 2, total: 5.5 }, { month: "2026-11", pitch: 1.25, roll: 1.25, total: 1.25 }]);
    // (an entry with two systems counts toward each system, once toward its month's total)

    const pitch = (await viewer.request("GET", `${B()}/log?system=pitch&from=2026-10-01&to=2026-10-31`)).body;
    expect(pitch.entries.map((x: { title: string }) => x.title)).toEqual(["Made the aft pushrod"]);
    const text = (await viewer.request("GET", `${B()}/log?q=DEBURRED`)).body;
    expect(text.entries.length).toBe(1);
    const badFilter = await viewer.request("GET", `${B()}/log?from=last-week`);
    expect([badFilter.status, Object.keys(badFilter.body.error.fields)]).toEqual([400, ["from"]]);
  });

  it("exports a date range as a PDF with the photo, the linkage picture and the caution on every page", async () => {
    const est = await viewer.request("GET", `${B()}/log/estimate?from=2026-10-01&to=2026-10-31`);
    expect(est.body.estimate).toMatchObject({ entries: 2, photos: 1, large: false });
    const res = await exportFile(viewer, buildId, "log-pdf", { from: "2026-10-01", to: "2026-10-31" });
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.job.label).toContain("2 entries");
    expect(res.bytes.subarray(0, 5).toString()).toBe("%PDF-");
    const pages = renderPdf(res.bytes, "log");
    expect(pages.length).toBeGreaterThanOrEqual(1);
    const text = pdfText(res.bytes);
    expect(text).toContain("Made the aft pushrod");
    expect(text).toContain("Rudder pedals");
    expect(text).not.toContain("Torque stripes on the bellcrank"); // outside the range
    expect(text).toContain("revision 1");
    expect(squash(text)).toContain(squash(CAUTION_TEXT));
    expect(pdfImages(res.bytes)).toBeGreaterThanOrEqual(2); // the photo and the revision picture
  });

  it("prints photos from the database's copy of their thumbnails, and copies one kept only in storage the first time", async () => {
    const [a, b] = await Promise.all(["copy in the database.jpg", "storage only.jpg"].map(async (name, i) =>
      (await upload(owner, `${B()}/files`, { bytes: await testImage("jpeg", 800 + i, 600), name })).body.file));
    const rowA = await testDb("files").where({ id: a.id }).first();
    const rowB = await testDb("files").where({ id: b.id }).first();
    // The upload keeps the thumbnail in both places, byte for byte.
    const copyA = await testDb("file_thumbnails").where({ file_id: a.id }).first();
    expect(copyA.bytes.equals((await fetchBytes(owner, a.thumbUrl)).bytes)).toBe(true);
    // A: storage's thumbnail is gone, so only the database's copy can print it. B: as a photo uploaded before copies were kept.
    await deleteTestObjects([rowA.thumb_key, rowA.key]);
    await testDb("file_thumbnails").where({ file_id: b.id }).del();
    const e = await owner.request("POST", `${B()}/log`, { date: "2026-08-01", hours: 1, title: "Two photos", systems: ["pitch"], fileIds: [a.id, b.id] });
    expect(e.status, JSON.stringify(e.body)).toBe(201);

    const res = await exportFile(viewer, buildId, "log-pdf", { from: "2026-08-01", to: "2026-08-01" });
    expect(pdfImages(res.bytes)).toBe(2);
    expect(pdfText(res.bytes)).toContain("storage only.jpg");
    const copyB = await testDb("file_thumbnails").where({ file_id: b.id }).first();
    expect(copyB?.bytes.equals((await fetchBytes(owner, b.thumbUrl)).bytes)).toBe(true);
  });

  it("prints names and signs beyond Latin-1 as typed (embedded font), and an emoji as ?", async () => {
    const title = "Łukasz fitted the Höhenruder horn ↔ pushrod, ±0.5° play, ≥ 2 threads";
    const r = await owner.request("POST", `${B()}/log`, { date: "2026-09-15", hours: 0.5, title, text: "Ωmega check 🛩 done", systems: ["pitch"] });
    expect(r.status).toBe(201);
    const res = await exportFile(viewer, buildId, "log-pdf", { from: "2026-09-15", to: "2026-09-15" });
    const text = pdfText(res.bytes);
    expect(squash(text)).toContain(squash(title));
    expect(text).toContain("Ωmega check ? done");
    renderPdf(res.bytes, "log-unicode");
  });
});

describe("hardware list and checklist", () => {
  it("lists the demo's hardware with quantities and keeps a state per line", async () => {
    const lines = (await viewer.request("GET", `${B()}/hardware`)).body.lines;
    const jam = lines.find((l: { key: string }) => l.key === "jamNut|1/4-28|LH");
    // Two: the one fitted, and the one the seeded wrong joint needs (it has none; the list says to get it).
    expect(jam).toMatchObject({ quantity: 2, state: "to_order", usedIn: [{ jointId: "j-fwd-bellcrank", linkageId }, { jointId: "j-aft-horn", linkageId }] });
    expect((await viewer.request("PUT", `${B()}/hardware`, { key: jam.key, state: "received" })).status).toBe(403);
    expect((await owner.request("PUT", `${B()}/hardware`, { key: jam.key, state: "received" })).status).toBe(200);
    expect((await owner.request("PUT", `${B()}/hardware`, { key: "nothing|here", state: "received" })).status).toBe(404);
    const after = (await viewer.request("GET", `${B()}/hardware`)).body.lines.find((l: { key: string }) => l.key === jam.key);
    expect(after.state).toBe("received");
    const csv = (await exportFile(viewer, buildId, "hardware-csv")).bytes.toString("utf8");
    expect(csv).toContain('jamNut,Jam nut 1/4-28 LH,,2,Received,"Pitch run: Forward pushrod B ↔ Bellcrank under the seat, in | Pitch run: Aft pushrod B ↔ Elevator horn, attach"');
  });

  it("names a line's first three places and counts the rest; ?line= gives that line whole (the CSV always has all)", async () => {
    const lines = (await viewer.request("GET", `${B()}/hardware`)).body.lines as { key: string; usedIn: unknown[]; usedInCount: number; quantity: number }[];
    const many = lines.find((l) => l.usedInCount > 3);
    expect(many, "the demo has a part used at more than three joints").toBeDefined();
    expect(many!.usedIn).toHaveLength(3);
    for (const l of lines) expect(l.usedIn.length).toBe(Math.min(3, l.usedInCount));
    const whole = await viewer.request("GET", `${B()}/hardware?line=${encodeURIComponent(many!.key)}`);
    expect(whole.status).toBe(200);
    expect(whole.body.lines).toHaveLength(1);
    expect(whole.body.lines[0].usedIn).toHaveLength(many!.usedInCount);
    expect(whole.body.lines[0].usedIn.slice(0, 3)).toEqual(many!.usedIn);
    expect((await viewer.request("GET", `${B()}/hardware?line=nothing%7Chere`)).status).toBe(404);
    const bad = await viewer.request("GET", `${B()}/hardware?line=`);
    expect([bad.status, Object.keys(bad.body.error.fields ?? {})]).toEqual([400, ["line"]]);
  });

  it("ticks checklist items with person and time, keeps a note, and prints a PDF", async () => {
    const first = (await viewer.request("GET", `${L()}/checklist`)).body;
    const count = checklistFor(demoPitchLinkage()).length; // each item checked in tests/shared/records (demo linkage)
    expect(first.items.length).toBe(count);
    const tick = await reviewer.request("PUT", `${L()}/checklist`, { revision: 1, jointId: DEMO_WRONG_JOINT, code: "retaining-washer", ticked: false, note: "Washer 0.438 in, smaller than the 0.500 in housing bore: replace." });
    expect(tick.status).toBe(200);
    const ok = await reviewer.request("PUT", `${L()}/checklist`, { revision: 1, jointId: "j-stick-fwd", code: "jam-nut", ticked: true });
    expect(ok.body.item).toMatchObject({ tickedBy: "Test rec-reviewer" });
    expect(Date.now() - Date.parse(ok.body.item.tickedAt)).toBeLessThan(60_000);
    expect((await viewer.request("PUT", `${L()}/checklist`, { revision: 1, jointId: "j-stick-fwd", code: "jam-nut", ticked: true })).status).toBe(403);
    const wrong = await reviewer.request("PUT", `${L()}/checklist`, { revision: 1, jointId: "j-stick-pivot", code: "jam-nut", ticked: true });
    expect([wrong.status, wrong.body.error.fields]).toEqual([400, { code: "not on this checklist" }]);
    const items = (await viewer.request("GET", `${L()}/checklist`)).body.items;
    expect(items.find((i: { jointId: string; code: string }) => i.jointId === DEMO_WRONG_JOINT && i.code === "retaining-washer")).toMatchObject({ tickedAt: null, note: expect.stringContaining("replace") });

    const pdf = await exportFile(viewer, buildId, "checklist-pdf", { linkageId });
    renderPdf(pdf.bytes, "checklist");
    const text = pdfText(pdf.bytes);
    expect(text).toContain(`1 of ${count} items ticked`);
    // The stored check's open findings come first: the list is not complete while they stand (demo: 2 hazards, 1 caution).
    expect(squash(text)).toContain(squash("Not complete while these stand: 2 open hazards and 1 open caution"));
    expect(squash(text)).toContain(squash("Hazard — Jam nut missing"));
    expect(text).toContain("Ticked by Test rec-reviewer");
    expect(squash(text)).toContain(squash(CAUTION_TEXT));
  });
});

// ---- PDF helpers: poppler-utils (installed by scripts/test.mjs) ---------------------------------

/** Renders every page to PNG in tests/artifacts/records/ (to be looked at) and returns the files. */
function renderPdf(bytes: Buffer, name: string): string[] {
  const dir = path.join(ARTIFACTS, name);
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  writeFileSync(path.join(dir, `${name}.pdf`), bytes);
  const r = spawnSync("/usr/bin/pdftoppm", ["-png", "-r", "60", path.join(dir, `${name}.pdf`), path.join(dir, "page")], { encoding: "utf8" });
  expect(r.status, r.stderr).toBe(0);
  const pages = readdirSync(dir).filter((f) => f.endsWith(".png")).sort();
  for (const p of pages) expect(readFileSync(path.join(dir, p)).subarray(1, 4).toString()).toBe("PNG");
  return pages;
}
function pdfText(bytes: Buffer): string {
  const f = path.join(ARTIFACTS, `text-${Date.now()}.pdf`);
  writeFileSync(f, bytes);
  const r = spawnSync("/usr/bin/pdftotext", ["-layout", f, "-"], { encoding: "utf8" });
  rmSync(f);
  return r.stdout;
}
function pdfImages(bytes: Buffer): number {
  const f = path.join(ARTIFACTS, `img-${Date.now()}.pdf`);
  writeFileSync(f, bytes);
  const r = spawnSync("/usr/bin/pdfimages", ["-list", f], { encoding: "utf8" });
  rmSync(f);
  return r.stdout.trim().split("\n").slice(2).length;
}
const squash = (s: string) => s.replace(/\s+/g, " ").replace(/—/g, "-").trim();
