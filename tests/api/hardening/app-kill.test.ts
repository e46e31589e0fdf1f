/**
 * The app killed with SIGKILL in the middle of saves and uploads (an app server of this test's own, so the
 * shared test server stays up), then started again:
 *  - the last save the app acknowledged is stored as sent, and nothing after it but a whole revision;
 *  - every acknowledged upload has its row and its objects;
 *  - the upload cut off between its objects and its row (held there by a lock the test takes on the files
 *    table, so the kill lands in that window every time) leaves objects no row names, which the sweep at
 *    start (lib/orphan-sweep.ts, in the export worker) leaves alone while it is younger than an hour
 *    (an upload in flight looks the same) and removes once it is older — checked by ageing it, and
 *    objects the test puts in the bucket, on the S3 fake's disk (its LastModified is the file's mtime).
 */
import { spawnSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { existsSync, utimesSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPitchLinkage } from "@/shared/demo";
import { graphPut } from "@/shared/schemas/graph";
import { makeBuild, makeUser, testDb } from "../../support/db";
import { TEST_PORT } from "../../support/env";
import { signIn, type Client } from "../../support/http";
import { appLog, killApp, startApp, type AppInstance } from "../../support/app-instance";
import { fixtureFile, putTestObject, s3Keys, testImage } from "../../support/upload";
import { addRevision } from "../../support/review";

const PORT = TEST_PORT + 4; // +1 the two-instance test, +2 and +3 the benches
const ROOT = path.resolve(__dirname, "../../..");
const BUCKET_DIR = path.join(ROOT, ".data/s3-test/linkwright");
const objectFile = (key: string) => path.join(BUCKET_DIR, `${key}._S3rver_object`);
const HOUR = 60 * 60 * 1000;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

let app: AppInstance | null = null;
let me: Client;
let ownerEmail = "";
let ownerId = "";
let buildId = "";
let linkageId = "";
const graphOf = (i: number) => ({ ...demoPitchLinkage(), name: `Save ${i}` });

beforeAll(async () => {
  const owner = await makeUser("app-kill");
  ownerEmail = owner.email;
  ownerId = owner.id;
  ({ buildId, linkageId } = await makeBuild({ owner }));
  await addRevision(linkageId, graphOf(0), owner.id); // revision 2
  app = await startApp(PORT, "app-kill");
  me = await signIn(owner.email, undefined, app.url);
}, 120_000);
afterAll(async () => {
  if (app) await killApp(app);
  await testDb.destroy();
});

/** A photo uploaded to this test's own app (the shared helper sends to the shared server). */
async function upload(bytes: Buffer) {
  const form = new FormData();
  form.set("file", new Blob([bytes as Uint8Array<ArrayBuffer>], { type: "image/png" }), "witness.png");
  const res = await fetch(`${app!.url}/api/builds/${buildId}/files`, { method: "POST", headers: { cookie: me.cookie }, body: form });
  return { status: res.status, body: await res.json().catch(() => null) };
}

/** The export worker an app instance started beside it (lib/jobs/supervisor.ts). */
async function workerOf(a: AppInstance) {
  for (let k = 0; k < 100; k++) {
    const r = spawnSync("pgrep", ["-P", String(a.proc.pid), "-f", "scripts/worker.ts"], { encoding: "utf8" });
    const pid = Number(r.stdout.trim().split("\n")[0]);
    if (pid) return pid;
    await sleep(100);
  }
  throw new Error("the app started no export worker");
}
const alive = (pid: number) => { try { process.kill(pid, 0); return true; } catch { return false; } };

/** Keys under the build that no row names. */
async function unnamed() {
  const keys = await s3Keys(`builds/${buildId}/`);
  const rows = await testDb("files").where({ build_id: buildId }).select("key", "thumb_key");
  const jobs = await testDb("export_jobs").where({ build_id: buildId }).whereNotNull("result_key").pluck("result_key");
  const named = new Set([...rows.flatMap((r) => [r.key, r.thumb_key]), ...jobs]);
  return keys.filter((k) => !named.has(k));
}

/** Restarts the app (kill -9, then start) and waits for its sweep at start to report. */
async function restartAndSweep() {
  await killApp(app!);
  const before = appLog(app!).split("[storage] orphan sweep:").length;
  app = await startApp(PORT, "app-kill", { again: true });
  const until = Date.now() + 60_000;
  while (appLog(app).split("[storage] orphan sweep:").length === before) {
    if (Date.now() > until) throw new Error(`no sweep reported within 60 s (${app.log})`);
    await sleep(200);
  }
  me = await signIn(ownerEmail, undefined, app.url);
}

describe("the app killed with SIGKILL during saves and uploads", () => {
  const saved = { revision: 2, i: 0 };
  let uploaded: string[] = [];
  let orphansOfTheKill: string[] = [];

  it("keeps the last acknowledged save and every acknowledged upload", async () => {
    const image = await testImage("png", 800, 600);
    let stop = false;
    let sent = 0;
    const saves = (async () => {
      while (!stop) {
        const i = ++sent;
        const r = await me.request("PUT", `/api/builds/${buildId}/linkages/${linkageId}/graph`, { baseRevision: saved.revision, graph: graphOf(i) }).catch(() => null);
        if (r?.status === 200) Object.assign(saved, { revision: r.body.revision, i });
        else if (r) expect(r.status, JSON.stringify(r.body)).toBe(200);
      }
    })();
    await sleep(300);
    for (let k = 0; k < 2; k++) {
      const r = await upload(image);
      expect(r.status).toBe(201);
      uploaded.push(r.body.file.id);
    }
    // The third upload is held at its row (the test holds a lock that keeps rows out of files) once its photo and
    // thumbnail are in storage; the app is killed there, its saves still going on.
    const lock = await testDb.transaction();
    await lock.raw("lock table files in share mode");
    const keysBefore = (await s3Keys(`builds/${buildId}/`)).length;
    const third = upload(image).catch(() => null);
    const until = Date.now() + 20_000;
    while ((await s3Keys(`builds/${buildId}/`)).length < keysBefore + 2 && Date.now() < until) await sleep(20);
    await sleep(100); // the insert reaches the lock
    const worker = await workerOf(app!);
    await killApp(app!);
    await lock.rollback();
    stop = true;
    const [, thirdAnswer] = await Promise.all([saves, third]);
    expect(thirdAnswer?.status, "the upload cut off by the kill is never acknowledged").toBeUndefined();
    expect(saved.i, "saves acknowledged before the kill").toBeGreaterThan(0);
    expect(uploaded.length, "uploads acknowledged before the kill").toBe(2);

    // The killed app's export worker follows it out (it would otherwise run on beside the next app's).
    for (let k = 0; k < 150 && alive(worker); k++) await sleep(100);
    expect(alive(worker), `the killed app's export worker (pid ${worker}) still runs 15 s later`).toBe(false);

    orphansOfTheKill = await unnamed();
    app = await startApp(PORT, "app-kill", { again: true });
    me = await signIn(ownerEmail, undefined, app.url);

    const { current_revision: current } = await testDb("linkages").where({ id: linkageId }).first("current_revision");
    const rows = await testDb("linkage_revisions").where({ linkage_id: linkageId }).where("revision", ">=", saved.revision).orderBy("revision");
    console.log(`killed after ${sent} saves sent (${saved.i} acknowledged, revision ${saved.revision}; the database is at ${current}) and ${uploaded.length} uploads acknowledged; ${orphansOfTheKill.length} objects without a row: ${orphansOfTheKill.join(", ")}`);
    expect(current === saved.revision || current === saved.revision + 1, `revision ${current} after the last acknowledged ${saved.revision}`).toBe(true);
    expect(rows[0].graph).toEqual(graphPut.parse({ baseRevision: 1, graph: graphOf(saved.i) }).graph);
    if (rows[1]) expect(rows[1].graph, "the save in flight, stored whole").toEqual(graphPut.parse({ baseRevision: 1, graph: graphOf(saved.i + 1) }).graph);
    // …and the app serves it.
    const g = await me.request("GET", `/api/builds/${buildId}/linkages/${linkageId}/graph`);
    expect([g.status, g.body.revision, g.body.graph.name]).toEqual([200, current, rows[rows.length - 1].graph.name]);

    for (const id of uploaded) {
      const row = await testDb("files").where({ id }).first("key", "thumb_key");
      expect(row, `the row of upload ${id}`).toBeDefined();
      for (const key of [row.key, row.thumb_key]) expect(existsSync(objectFile(key)), key).toBe(true);
      expect((await fetch(`${app.url}/api/builds/${buildId}/files/${id}`, { headers: { cookie: me.cookie } })).status).toBe(200);
    }
    // The killed upload's photo and thumbnail are in storage and no row names them.
    expect(orphansOfTheKill.map((k) => k.split("/")[2]).sort()).toEqual(["files", "thumbs"]);
  }, 180_000);

  it("the sweep at start leaves objects younger than an hour alone and removes older ones no row names", async () => {
    expect(orphansOfTheKill.length, "the first test left the kill's orphans").toBeGreaterThan(0);
    const ago = (ms: number) => new Date(Date.now() - ms);
    const age = (key: string, ms: number) => utimesSync(objectFile(key), ago(ms), ago(ms));
    const put = async (key: string) => { await putTestObject(key, Buffer.from("x"), "application/octet-stream"); return key; };

    // Young: the kill's orphans as they are, an object just written with no row (an upload in flight), one 59 minutes old.
    const inFlight = await put(`builds/${buildId}/files/${randomUUID()}.png`);
    const almost = await put(`builds/${buildId}/thumbs/${randomUUID()}.jpg`);
    age(almost, HOUR - 60_000);
    await restartAndSweep();
    expect(await unnamed()).toEqual(expect.arrayContaining([...orphansOfTheKill, inFlight, almost]));

    // Aged past the hour: the kill's orphans, a stray photo and an export's file whose job has no such result; and,
    // as old, objects rows name (a photo and its thumbnail, an export's result) and a key of a shape the app never writes.
    for (const k of orphansOfTheKill) age(k, HOUR + 60_000);
    const stray = await put(`builds/${buildId}/files/${randomUUID()}.jpg`);
    const strayExport = await put(`builds/${buildId}/exports/${randomUUID()}/hardware.csv`);
    for (const k of [stray, strayExport]) age(k, 2 * HOUR);
    const fileId = await fixtureFile(buildId, null);
    const file = await testDb("files").where({ id: fileId }).first("key", "thumb_key");
    const [job] = await testDb("export_jobs").insert({ build_id: buildId, user_id: ownerId, kind: "hardware-csv", params: "{}", label: "Hardware list CSV", status: "done", progress: 1, result_name: "hardware.csv", result_type: "text/csv", result_size: 1 }).returning("id");
    const result = await put(`builds/${buildId}/exports/${job.id}/hardware.csv`);
    await testDb("export_jobs").where({ id: job.id }).update({ result_key: result });
    const foreign = await put(`builds/${buildId}/notes/readme.txt`);
    for (const k of [file.key, file.thumb_key, result, foreign]) age(k, 3 * HOUR);

    await restartAndSweep();
    const left = await s3Keys(`builds/${buildId}/`);
    for (const k of [...orphansOfTheKill, stray, strayExport]) expect(left, `${k} (older than an hour, no row)`).not.toContain(k);
    for (const k of [inFlight, almost, file.key, file.thumb_key, result, foreign]) expect(left, k).toContain(k);
    for (const id of uploaded) expect((await fetch(`${app!.url}/api/builds/${buildId}/files/${id}`, { headers: { cookie: me.cookie } })).status).toBe(200);
    console.log(appLog(app!).split("\n").filter((l) => l.includes("[storage]")).join("\n"));
  }, 240_000);
});
