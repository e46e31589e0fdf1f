/**
 * Large linkages are checked in an engine thread (lib/engine/threads.ts), so one account posting the largest
 * bodies the API takes does not hold up everyone else's requests:
 *  - a large save is stored and answered exactly as a small one (the report the engine gives, its summary),
 *    and a large body that does not fit the schema is refused the same way and changes nothing;
 *  - while three 4 MB checks run, the shared test server (engine threads on) keeps answering GET /api/health
 *    at once; an app of this test's own with LW_ENGINE_THREADS=0 (the engine in the request's thread, as
 *    before) keeps each of those answers waiting for a whole check.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import { generateLinkage } from "@/shared/demo";
import { graphSchema } from "@/shared/linkage/schema";
import { makeBuild, makeUser, testDb } from "../../support/db";
import { APP_URL, TEST_PORT } from "../../support/env";
import { signIn, type Client } from "../../support/http";
import { killApp, startApp, type AppInstance } from "../../support/app-instance";

const PORT = TEST_PORT + 5; // +1 the two-instance test, +2 and +3 the benches, +4 the app-kill test
/** Over the 256 K characters done in the request's own thread, under the 5 MB body cap. */
const LARGE_PARTS = 4_000;

let inline: AppInstance | null = null;
let me: Client;
let email = "";
let buildId = "";
let linkageId = "";

beforeAll(async () => {
  const owner = await makeUser("engine-threads");
  email = owner.email;
  ({ buildId, linkageId } = await makeBuild({ owner }));
  me = await signIn(owner.email);
  inline = await startApp(PORT, "engine-inline", { env: { LW_ENGINE_THREADS: "0", LW_WORKER: "0" } });
}, 120_000);
afterAll(async () => {
  if (inline) await killApp(inline);
  await testDb.destroy();
});

const currentRevision = async () => (await testDb("linkages").where({ id: linkageId }).first("current_revision")).current_revision as number;

describe("a large save", () => {
  it("is stored with the engine's report of it and that report's summary", async () => {
    const graph = generateLinkage(LARGE_PARTS);
    const text = JSON.stringify({ baseRevision: await currentRevision(), graph });
    expect(text.length).toBeGreaterThan(256 * 1024);
    const res = await me.request("PUT", `/api/builds/${buildId}/linkages/${linkageId}/graph`, undefined, text);
    expect(res.status).toBe(200);
    const report = analyze(graphSchema.parse(graph));
    expect(res.body.analysis).toEqual(JSON.parse(JSON.stringify(report)));
    const row = await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: res.body.revision }).first(testDb.raw("analysis::text as analysis"), "summary");
    expect(row.analysis).toBe(JSON.stringify(report));
    expect(row.summary).toEqual(report.summary);
  });

  it("that does not fit the schema is refused with the field named, and nothing is saved", async () => {
    const graph = generateLinkage(LARGE_PARTS);
    graph.nodes.push(graph.nodes[7]);
    const before = await currentRevision();
    const res = await me.request("PUT", `/api/builds/${buildId}/linkages/${linkageId}/graph`, undefined, JSON.stringify({ baseRevision: before, graph }));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid_input");
    expect(res.body.error.fields[`graph.nodes.${LARGE_PARTS}.id`]).toMatch(/duplicate node id/);
    expect(await currentRevision()).toBe(before);
  });
});

/** The longest wait for GET /api/health, asked one after another while three 4 MB checks run on `base`. */
async function healthWaitDuringLargeChecks(base: string, cookie: string) {
  const body = JSON.stringify({ graph: generateLinkage(LARGE_PARTS) });
  let running = 3;
  const checks = Array.from({ length: running }, async () => {
    const res = await fetch(`${base}/api/analyze`, { method: "POST", headers: { cookie, "content-type": "application/json" }, body });
    expect(res.status).toBe(200);
    expect((await res.json()).report.summary).toBeTruthy();
    running--;
  });
  await new Promise((r) => setTimeout(r, 50)); // the bodies on their way
  const waits: number[] = [];
  while (running > 0) {
    const t = performance.now();
    expect((await fetch(`${base}/api/health`)).status).toBe(200);
    waits.push(performance.now() - t);
  }
  await Promise.all(checks);
  return { longest: Math.max(...waits), asked: waits.length };
}

describe("while large checks run", () => {
  it("other requests are answered at once with engine threads, and wait for whole checks without them", async () => {
    const onInline = await signIn(email, undefined, inline!.url);
    const threads = await healthWaitDuringLargeChecks(APP_URL, me.cookie);
    const without = await healthWaitDuringLargeChecks(inline!.url, onInline.cookie);
    console.log(`longest wait for GET /api/health during three ${LARGE_PARTS}-part checks: ${threads.longest.toFixed(0)} ms with engine threads (${threads.asked} asked), ${without.longest.toFixed(0)} ms without (${without.asked} asked)`);
    // A check of this size is a few hundred ms of engine work, which an answer waits for without threads. With them,
    // the request's thread still reads the 4 MB bodies and sends the 9 MB answers: some tens of ms at a time, not the check.
    expect(without.longest).toBeGreaterThan(200);
    expect(threads.longest * 2).toBeLessThan(without.longest);
  });
});
