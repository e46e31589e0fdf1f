/** Deleting a build removes its rows and its stored files (its audit events stay, with who deleted it); another build's files stay. */
import { afterAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { signIn } from "../support/http";
import { s3Keys, testImage, upload } from "../support/upload";

afterAll(() => testDb.destroy());

describe("deleting a build", () => {
  it("takes its linkages, files and stored objects with it, and nothing of another build", async () => {
    const owner = await makeUser("deleter");
    const c = await signIn(owner.email);
    const doomed = await makeBuild({ owner });
    const kept = await makeBuild({ owner });
    for (const b of [doomed, kept]) {
      const r = await upload(c, `/api/builds/${b.buildId}/files`, { bytes: await testImage("jpeg", 640, 480), name: "joint.jpg", type: "image/jpeg" });
      expect(r.status).toBe(201);
    }
    const doomedKeys = await s3Keys(`builds/${doomed.buildId}/`);
    expect(doomedKeys.length).toBe(2); // the photo and its thumbnail
    const keptKeys = await s3Keys(`builds/${kept.buildId}/`);

    expect((await c.request("PATCH", `/api/builds/${doomed.buildId}`, { name: "Doomed build" })).status).toBe(200); // an event before
    const r = await c.request("DELETE", `/api/builds/${doomed.buildId}`);
    expect(r.status).toBe(200);
    expect(r.body.filesRemoved).toBe(2);
    expect(await s3Keys(`builds/${doomed.buildId}/`)).toEqual([]);
    expect(await s3Keys(`builds/${kept.buildId}/`)).toEqual(keptKeys);
    expect(await testDb("linkages").where({ build_id: doomed.buildId }).first()).toBeUndefined();
    expect(await testDb("files").where({ build_id: doomed.buildId }).first()).toBeUndefined();
    expect((await c.request("GET", `/api/builds/${doomed.buildId}`)).status).toBe(404);
    // Its audit events stay, with who deleted it and when.
    const events = await testDb("audit_events").where({ build_id: doomed.buildId }).orderBy("id");
    expect(events.map((e: { action: string }) => e.action)).toContain("build.update");
    expect(events.at(-1)).toMatchObject({ action: "build.delete", user_id: owner.id, detail: { name: "Doomed build", files: 1 } });
  });
});
