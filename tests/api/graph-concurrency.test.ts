import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { anonymous, signIn, type Client } from "../support/http";
import { emptyGraph } from "@/shared/linkage/schema";

let owner: Client;
let outsider: Client;
let ids: { buildId: string; linkageId: string };
let theirs: { buildId: string; linkageId: string };

beforeAll(async () => {
  const u = await makeUser("racer");
  const x = await makeUser("outsider");
  owner = await signIn(u.email);
  outsider = await signIn(x.email);
  ids = await makeBuild({ owner: u });
  theirs = await makeBuild({ owner: x });
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

describe("a revision read with the request's access (one query)", () => {
  const url = (q = "", o = ids) => `/api/builds/${o.buildId}/linkages/${o.linkageId}/graph${q}`;

  it("the current revision, or the one asked for, with its author and stored report", async () => {
    const cur = await owner.request("GET", url());
    expect(cur.status).toBe(200);
    expect(cur.body.revision).toBeGreaterThanOrEqual(3); // the saves above
    expect(cur.body.graph.name).toBe("next");
    expect(cur.body.analysis).toBeTypeOf("object");
    expect(cur.body.author.name).toBeTypeOf("string");
    const first = await owner.request("GET", url("?revision=1"));
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ revision: 1, graph: { name: "Pitch run" }, analysis: null });
    const two = await owner.request("GET", url("?revision=2"));
    expect(two.body.revision).toBe(2);
    expect(two.body.graph.name).toMatch(/^attempt \d+$/);
  });

  it("refusals keep their order: signed out 401, non-member 404 whatever the revision, then a bad or unknown revision 404", async () => {
    expect((await anonymous().request("GET", url("?revision=abc"))).status).toBe(401);
    for (const q of ["", "?revision=1", "?revision=abc"]) {
      const r = await outsider.request("GET", url(q));
      expect(r.status, q).toBe(404);
      expect(r.body.error.message).not.toMatch(/revision/);
    }
    // Another build's linkage under this build's id: the linkage is not found, its revisions are not read.
    expect((await owner.request("GET", url("?revision=1", { buildId: ids.buildId, linkageId: theirs.linkageId }))).body.error.message).toMatch(/linkage/);
    for (const q of ["?revision=abc", "?revision=0", "?revision=999"]) {
      const r = await owner.request("GET", url(q));
      expect(r.status, q).toBe(404);
      expect(r.body.error.code).toBe("not_found");
    }
  });
});

describe("the build's changed time, moved by saves", () => {
  const url = () => `/api/builds/${ids.buildId}/linkages/${ids.linkageId}/graph`;
  const changed = async () => (await testDb("builds").where({ id: ids.buildId }).first("updated_at")).updated_at as Date;
  const save = async () => {
    const cur = await owner.request("GET", url());
    const r = await owner.request("PUT", url(), { baseRevision: cur.body.revision, graph: emptyGraph("changed time", "pitch") });
    expect(r.status).toBe(200);
  };

  it("a save moves a build's changed time that is older than a minute", async () => {
    await testDb("builds").where({ id: ids.buildId }).update({ updated_at: testDb.raw("now() - interval '2 minutes'") });
    const before = await changed();
    await save();
    expect((await changed()).getTime()).toBeGreaterThan(before.getTime() + 60_000);
  });

  it("saves within a minute of it leave it (one write to the build's row a minute, however many members save)", async () => {
    await testDb("builds").where({ id: ids.buildId }).update({ updated_at: testDb.raw("now() - interval '20 seconds'") });
    const before = await changed();
    await save();
    await save();
    expect((await changed()).getTime()).toBe(before.getTime());
  });
});
