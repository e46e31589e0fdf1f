/** The build's design settings: saved, and every linkage's current revision checked again with them. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { demoPitchLinkage } from "@/shared/demo";

let owner: Client;
let ids: { buildId: string; linkageId: string };
beforeAll(async () => {
  const u = await makeUser("settings-owner");
  owner = await signIn(u.email);
  ids = await makeBuild({ owner: u });
  const r = await owner.request("PUT", `/api/builds/${ids.buildId}/linkages/${ids.linkageId}/graph`, { baseRevision: 1, graph: demoPitchLinkage() });
  expect(r.status).toBe(200);
});
afterAll(() => testDb.destroy());

const current = async () => (await owner.request("GET", `/api/builds/${ids.buildId}/linkages/${ids.linkageId}/graph`)).body;

describe("build design settings", () => {
  it("a doubled pitch stick force doubles the stored pushrod loads of the current revision", async () => {
    const before = await current();
    expect(before.analysis.settings.pilotForce.pitchStick).toBe(167); // 14 CFR 23.397(b) default
    const r = await owner.request("PATCH", `/api/builds/${ids.buildId}`, {
      analysisSettings: { pilotForce: { pitchStick: 334, rollStick: 67, yawPedal: 200, other: 100 } },
    });
    expect(r.status).toBe(200);
    expect(r.body.build.analysisSettings.pilotForce.pitchStick).toBe(334);
    expect(r.body.build.analysisSettings.ultimateFactor).toBe(1.5); // the rest keep their defaults (14 CFR 23.303)
    const after = await current();
    expect(after.revision).toBe(before.revision); // no new revision: the same drawing, checked again
    expect(after.analysis.settings.pilotForce.pitchStick).toBe(334);
    before.analysis.pushrods.forEach((p: { nodeId: string; limitAxial: number }, i: number) => {
      expect(after.analysis.pushrods[i].limitAxial).toBeCloseTo(2 * p.limitAxial, 6);
    });
  });

  it("keeps earlier settings when only one factor changes", async () => {
    const r = await owner.request("PATCH", `/api/builds/${ids.buildId}`, { analysisSettings: { fittingFactor: 1.25 } });
    expect(r.status).toBe(200);
    expect(r.body.build.analysisSettings.fittingFactor).toBe(1.25);
    expect(r.body.build.analysisSettings.pilotForce.pitchStick).toBe(334);
    expect((await current()).analysis.settings.fittingFactor).toBe(1.25);
  });

  it("a patch changes only what it names: the settings leave the model alone, a new name leaves the model and the settings", async () => {
    const before = (await owner.request("GET", `/api/builds/${ids.buildId}`)).body.build;
    expect(before.model).toBe("test model");
    let r = await owner.request("PATCH", `/api/builds/${ids.buildId}`, { analysisSettings: { fittingFactor: 1.3 } });
    expect(r.body.build.model).toBe("test model");
    r = await owner.request("PATCH", `/api/builds/${ids.buildId}`, { name: "Renamed build" });
    expect(r.status).toBe(200);
    expect(r.body.build).toMatchObject({ name: "Renamed build", model: "test model", registration: before.registration });
    expect(r.body.build.analysisSettings.fittingFactor).toBe(1.3);
    expect((await owner.request("PATCH", `/api/builds/${ids.buildId}`, {})).status).toBe(400);
  });
});
