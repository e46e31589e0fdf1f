/** A log entry whose text is one very long word prints promptly, broken across lines, with nothing lost. */
import { afterAll, beforeAll, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../../support/db";
import { signIn, type Client } from "../../support/http";
import { exportFile } from "../../support/exports";

let owner: Client, buildId: string;
beforeAll(async () => {
  const o = await makeUser("pdf-owner");
  ({ buildId } = await makeBuild({ owner: o }));
  owner = await signIn(o.email);
});
afterAll(() => testDb.destroy());

it("prints a log entry made of one word at the text cap (20,000 characters)", async () => {
  const word = "A".repeat(20_000);
  const r = await owner.request("POST", `/api/builds/${buildId}/log`, { date: "2026-11-02", hours: 1, title: "T".repeat(200), text: word });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  // the cap is enforced at the schema
  const over = await owner.request("POST", `/api/builds/${buildId}/log`, { date: "2026-11-02", hours: 1, title: "x", text: `${word}A` });
  expect(over.status).toBe(400);
  const res = await exportFile(owner, buildId, "log-pdf"); // a cubic wrapper held this for hours
  expect(res.bytes.subarray(0, 5).toString()).toBe("%PDF-");
}, 120_000);
