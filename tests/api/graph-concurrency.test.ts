import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { emptyGraph } from "@/shared/linkage/schema";

let owner: Client;
let ids: { buildId: string; linkageId: string };

beforeAll(async () => {
  const u = await makeUser("racer");
  owner = await signIn(u.email);
  ids = await makeBuild({ owner: u });
});
afterAll(() => testDb.destroy());

const revisions = async () => Number((await testDb("linkage_revisions").where({ linkage_id: ids.linkageId }).count("* as n"))[0].n);

describe("optimistic concurrency on linkage revisions", () => {
  it("20 parallel saves on the same base revision: exactly one wins, the rest get 409", async () => {
    const before = await revisions();
    const url = `/api/builds/${ids.buildId}/linkages/${ids.linkageId}/graph`;
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) => owner.request("PUT", url, { baseRevision: 1, graph: { ...emptyGraph(`attempt ${i}`, "pitch") } })),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    expect(await revisions()).toBe(before + 1);

    const winner = results.find((r) => r.status === 200)!;
    expect(winner.body.revision).toBe(2);
    const loser = results.find((r) => r.status === 409)!;
    expect(loser.body.error.code).toBe("stale_revision");
    expect(loser.body.error.current.revision).toBe(2);
    // The stored graph is the winner's, whole.
    const current = await owner.request("GET", url);
    expect(current.body.revision).toBe(2);
    expect(results.map((r, i) => (r.status === 200 ? `attempt ${i}` : null)).filter(Boolean)).toEqual([current.body.graph.name]);
  });

  it("a save on the new current revision succeeds and the chain continues", async () => {
    const url = `/api/builds/${ids.buildId}/linkages/${ids.linkageId}/graph`;
    const cur = await owner.request("GET", url);
    const r = await owner.request("PUT", url, { baseRevision: cur.body.revision, graph: emptyGraph("next", "pitch") });
    expect(r.status).toBe(200);
    expect(r.body.revision).toBe(cur.body.revision + 1);
    expect(r.body.analysis).toBeTypeOf("object");
  });
});
