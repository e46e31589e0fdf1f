/**
 * What the joint card, the run list and the canvas say a joint's check covers (editor/joints/coverage.ts):
 * "no findings" reads green only where checks were made; a cable over a pulley or a terminal screwed into a
 * turnbuckle has nothing of its own to check; a joint missing what holds it is "not checked yet".
 */
import { describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import { demoRudderLinkage } from "@/shared/demo-rudder";
import { demoPitchLinkage } from "@/shared/demo";
import type { LinkageGraph } from "@/shared/linkage/schema";
import { emptyJointChip, jointCoverage, jointHardwareLine, jointResult } from "@/editor/joints/coverage";
import { hardwareChips } from "@/editor/joints/JointEdge";
import { jointAccessibleName } from "@/editor/a11y";
import { severityCount } from "@/editor/presentation";

function coverageOf(g: LinkageGraph, id: string) {
  const report = analyze(g);
  const j = g.joints.find((x) => x.id === id)!;
  return { j, c: jointCoverage(j, g.nodes, jointResult(report, id), true), findings: report.findings.filter((f) => f.subject.type === "joint" && f.subject.id === id) };
}

describe("the yaw run's joints", () => {
  const g = demoRudderLinkage();

  it("a cable terminal screwed into a turnbuckle's barrel: nothing to check here, the parts' cards say the rest — not a green all-clear", () => {
    for (const id of ["rd-j-tb-left", "rd-j-tb-right"]) {
      const { j, c, findings } = coverageOf(g, id);
      expect(findings).toHaveLength(0);
      expect(c.state).toBe("nothingHere");
      expect(c.text).toMatch(/^Nothing to check here: the terminal of (Left|Right) rudder cable screws into the barrel of (Left|Right) turnbuckle, with no bolt\./);
      expect(c.text).not.toMatch(/no findings|Add the bolt/i);
      expect(c.short).toBe("nothing to check");
      expect(jointHardwareLine(j, g.nodes)).toBe("terminal screwed into the turnbuckle — no bolt");
      expect(jointAccessibleName(j, g.nodes, undefined, c.short)).toMatch(/, no findings, nothing to check$/);
    }
  });

  it("a cable over a pulley or through a fairlead is labelled for what it is, not 'no hardware recorded yet'", () => {
    const pulley = coverageOf(g, "rd-j-over-pulley");
    expect(pulley.c.state).toBe("nothingHere");
    expect(pulley.c.text).toContain("Left rudder cable runs over Pulley at the seat frame");
    expect(jointHardwareLine(pulley.j, g.nodes)).toBe("cable over the pulley — nothing bolted here");
    expect(hardwareChips(pulley.j.hardware, emptyJointChip(pulley.j, g.nodes))).toMatchObject([{ key: "empty", text: "over pulley", quiet: true }]);
    const fairlead = coverageOf(g, "rd-j-thru-fairlead");
    expect(fairlead.c.state).toBe("nothingHere");
    expect(jointHardwareLine(fairlead.j, g.nodes)).toBe("cable through the fairlead — nothing bolted here");
  });

  it("a bolted joint whose checks were all made is the one that reads 'no findings'", () => {
    const { j, c } = coverageOf(g, "rd-j-pedal-left");
    expect(c.state).toBe("checked");
    expect(c.short).toBe("no findings");
    expect(c.text).toMatch(/^No findings here from the live check: \d+ checks made/);
    expect(jointHardwareLine(j, g.nodes)).toBe("bolt AN3");
  });

  it("a cable terminal with no bolt or pin is 'not checked', its fastener listed with what to enter and told as a caution", () => {
    const bare = demoRudderLinkage();
    const j = bare.joints.find((x) => x.id === "rd-j-pedal-left")!;
    j.hardware = { torqueStripe: false, photos: [], note: "" };
    const { c, findings } = coverageOf(bare, "rd-j-pedal-left");
    expect(c.state).toBe("notChecked");
    expect(c.short).toBe("not checked");
    expect(c.text).toContain("What to enter is under Checks");
    expect(findings.map((f) => f.code)).toContain("fastener-not-recorded");
    expect(jointHardwareLine(j, bare.nodes)).toBe("no bolt or clevis pin recorded yet");
    expect(emptyJointChip(j, bare.nodes).text).toBe("no bolt");
    // Its nut and washers recorded but no bolt: still not checked, and still told.
    j.hardware = { ...j.hardware, nut: { type: "castellatedCotter", pattern: "shear", cotterPinNew: true }, washerUnderHead: { outsideDiameter: 0.438, thickness: 0.032 } };
    const nut = coverageOf(bare, "rd-j-pedal-left");
    expect(nut.findings.map((f) => f.code)).toContain("fastener-not-recorded");
    expect(nut.c).toMatchObject({ state: "notChecked", short: "not checked" });
  });

  it("a bolt recorded at a turnbuckle's end (a fork on an eye) is checked as any bolted joint", () => {
    const bolted = demoRudderLinkage();
    const tb = bolted.joints.find((x) => x.id === "rd-j-tb-right")!;
    tb.hardware = bolted.joints.find((x) => x.id === "rd-j-horn-right")!.hardware;
    expect(coverageOf(bolted, "rd-j-tb-right").c.state).not.toBe("nothingHere");
  });
});

describe("a joint partly checked", () => {
  it("says which part is not made, in the caution's words, never a green all-clear", () => {
    const g = demoPitchLinkage();
    const j = g.joints.find((x) => x.id === "j-stick-pivot")!;
    delete (j.hardware as { shear?: unknown }).shear; // the fastener's shear is then not checked
    const { c } = coverageOf(g, "j-stick-pivot");
    expect(c).toMatchObject({ state: "partly", short: "partly checked" });
    expect(c.text).toMatch(/^Partly checked: no findings from the 4 checks made; 2 checks are not made yet/);
  });

  it("before the live check has run, nothing reads as checked", () => {
    const g = demoRudderLinkage();
    const j = g.joints[0];
    expect(jointCoverage(j, g.nodes, undefined, false)).toMatchObject({ state: "pending", short: "not checked yet" });
  });
});

describe("the summary strip's counts", () => {
  it("are singular for one and plural otherwise", () => {
    expect(severityCount(2, "hazard")).toBe("2 hazards");
    expect(severityCount(1, "caution")).toBe("1 caution");
    expect(severityCount(0, "advisory")).toBe("0 advisories");
  });
});
