/**
 * PostgreSQL stopped and started again under a save loop: the editor's saves (PUT graph, each on the
 * revision the last answer gave) go on while the test cluster shuts down and comes back. Every answer is
 * a save, a 409 naming the current revision, or a 503 while the database is away — never a 500; no
 * revision is half written (the revisions run 1…current with no gap, each row holds a graph that was
 * sent and the analysis of exactly that graph); every acknowledged save is stored as sent; and saves go
 * through again within 5 s of the database accepting connections. Only the test cluster is touched.
 */
import { afterAll, beforeAll, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import { demoPitchLinkage } from "@/shared/demo";
import { graphPut } from "@/shared/schemas/graph";
import { makeBuild, makeUser, testDb } from "../../support/db";
import { signIn, type Client } from "../../support/http";
import { startTestCluster, startTestClusterAsync, stopTestClusterAsync, testClusterRunning } from "../../support/cluster";

let me: Client;
let buildId = "";
let linkageId = "";

beforeAll(async () => {
  const owner = await makeUser("db-restart");
  ({ buildId, linkageId } = await makeBuild({ owner }));
  me = await signIn(owner.email);
});
afterAll(async () => {
  if (!testClusterRunning()) startTestCluster(); // never leave the other tests without their database
  await testDb.destroy();
});

const graphOf = (i: number) => ({ ...demoPitchLinkage(), name: `Save ${i}` });
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

it("keeps every revision whole through a database restart and saves again within 5 s of its return", async () => {
  type Answer = { i: number; status: number; at: number; revision?: number; code?: string };
  const answers: Answer[] = [];
  const acknowledged = new Map<number, number>(); // revision → the save that made it
  let base = 1;
  let running = true;
  let sent = 0;

  const loop = (async () => {
    while (running) {
      const i = ++sent;
      const r = await me.request("PUT", `/api/builds/${buildId}/linkages/${linkageId}/graph`, { baseRevision: base, graph: graphOf(i) }).catch((e) => ({ status: 0, body: String(e) }));
      const a: Answer = { i, status: r.status, at: performance.now(), code: r.body?.error?.code };
      answers.push(a);
      if (r.status === 200) {
        a.revision = base = r.body.revision;
        acknowledged.set(r.body.revision, i);
      } else if (r.status === 409) {
        base = r.body.error.currentRevision; // a save stored whose answer was lost: go on from it, as the editor does
      } else {
        await sleep(50);
      }
    }
  })();

  await sleep(1_500);
  const stopAt = performance.now();
  await stopTestClusterAsync();
  const downAt = performance.now();
  await sleep(1_500);
  const startAt = performance.now();
  await startTestClusterAsync();
  const backAt = performance.now(); // pg_ctl -w: the cluster accepts connections
  // Saves until one goes through after the return, then a second more.
  const until = backAt + 10_000;
  while (!answers.some((a) => a.status === 200 && a.at > backAt) && performance.now() < until) await sleep(50);
  await sleep(1_000);
  running = false;
  await loop;

  const firstBack = answers.find((a) => a.status === 200 && a.at > backAt);
  const count = (f: (a: Answer) => boolean) => answers.filter(f).length;
  console.log(
    `${answers.length} saves: ${count((a) => a.status === 200)} stored, ${count((a) => a.status === 503)} answered 503, ${count((a) => a.status === 409)} 409; ` +
      `the stop took ${(downAt - stopAt).toFixed(0)} ms, the start ${(backAt - startAt).toFixed(0)} ms; ` +
      `first save stored ${firstBack ? (firstBack.at - backAt).toFixed(0) : "—"} ms after the database was back`,
  );

  const statuses = [...new Set(answers.map((a) => a.status))].sort();
  expect(statuses.filter((s) => ![200, 409, 503].includes(s)), `answers other than 200, 409 and 503: ${JSON.stringify(answers.filter((a) => ![200, 409, 503].includes(a.status)).slice(0, 5))}`).toEqual([]);
  expect(answers.filter((a) => a.status === 503).every((a) => a.code === "unavailable")).toBe(true);
  // While the cluster was down (after the stop returned, before the start began) every answer was a 503.
  const whileDown = answers.filter((a) => a.at > downAt + 100 && a.at < startAt);
  expect(whileDown.length, "saves answered while the database was down").toBeGreaterThan(0);
  expect(whileDown.filter((a) => a.status !== 503)).toEqual([]);
  expect(count((a) => a.status === 200 && a.at < stopAt), "saves stored before the stop").toBeGreaterThan(0);
  expect(firstBack, "a save stored after the database came back").toBeDefined();
  expect(firstBack!.at - backAt, "ms from the database's return to the first stored save").toBeLessThan(5_000);

  // No partial revision: 1…current with no gap, each a graph that was sent with its own analysis.
  const { current_revision: current } = await testDb("linkages").where({ id: linkageId }).first("current_revision");
  const rows = await testDb("linkage_revisions").where({ linkage_id: linkageId }).orderBy("revision").select("revision", "graph", "analysis");
  expect(rows.map((r) => r.revision)).toEqual(Array.from({ length: current }, (_, k) => k + 1));
  expect(current).toBeGreaterThanOrEqual(Math.max(...acknowledged.keys()));
  for (const r of rows.slice(1)) {
    const i = Number(/^Save (\d+)$/.exec(r.graph.name)?.[1]);
    expect(i, `revision ${r.revision} holds a graph that was sent`).toBeGreaterThan(0);
    expect(r.graph, `revision ${r.revision}: the graph of save ${i}, whole`).toEqual(graphPut.parse({ baseRevision: 1, graph: graphOf(i) }).graph);
    expect(r.analysis, `revision ${r.revision}: the analysis of its own graph`).toEqual(JSON.parse(JSON.stringify(analyze(r.graph))));
    if (acknowledged.has(r.revision)) expect(i, `revision ${r.revision} is the save that was told so`).toBe(acknowledged.get(r.revision));
  }
}, 120_000);
