/**
 * Which joints of a cable run have nothing bolted (shared/linkage/contacts.ts): the one definition the check
 * (no bolt asked for) and the editor ("nothing to check here") both read.
 */
import { describe, expect, it } from "vitest";
import { boltlessContact, guideEnd } from "@/shared/linkage/contacts";
import { analyze } from "@/shared/analysis";
import { jointCoverage, jointResult, jointSort } from "@/editor/joints/coverage";
import { rudderCircuit } from "./../analysis/cable-fixtures";
import type { LinkageGraph } from "@/shared/linkage/schema";

const e = (kind: string, port: string) => ({ kind, port });

describe("boltless contacts", () => {
  it("a cable over a pulley's groove or through a fairlead passes through, from either side", () => {
    expect(boltlessContact(e("cable", "run"), e("pulley", "cable"))).toBe("passThrough");
    expect(boltlessContact(e("fairlead", "cable"), e("cable", "run"))).toBe("passThrough");
    expect(guideEnd(e("cable", "run"), e("pulley", "cable"))).toEqual(e("pulley", "cable"));
  });
  it("a cable's terminal in a turnbuckle's barrel is screwed in, from either side", () => {
    expect(boltlessContact(e("cable", "b"), e("turnbuckle", "a"))).toBe("screwedEnds");
    expect(boltlessContact(e("turnbuckle", "b"), e("cable", "a"))).toBe("screwedEnds");
  });
  it("a part on a pulley's pivot, two cables or two turnbuckles end to end, a terminal on a horn: held by a bolt or pin", () => {
    expect(boltlessContact(e("cable", "a"), e("pulley", "pivot"))).toBeNull();
    expect(boltlessContact(e("fairlead", "mount"), e("cable", "a"))).toBeNull();
    expect(boltlessContact(e("cable", "b"), e("cable", "a"))).toBeNull();
    expect(boltlessContact(e("turnbuckle", "b"), e("turnbuckle", "a"))).toBeNull();
    expect(boltlessContact(e("cable", "a"), e("controlHorn", "link"))).toBeNull();
    expect(guideEnd(e("cable", "a"), e("pulley", "pivot"))).toBeNull();
  });
});

describe("the check and the editor read the same joints as boltless", () => {
  /** The base rudder circuit with one cable's end moved from its turnbuckle to the pulley's pivot, unbolted. */
  const onPivot = (): LinkageGraph => {
    const g = rudderCircuit();
    return { ...g, joints: g.joints.map((x) => (x.id === "tbLa" ? { ...x, to: { node: "pulley", port: "pivot" }, hardware: { ...x.hardware, bolt: undefined } } : x)) };
  };
  const verdicts = (g: LinkageGraph) => {
    const r = analyze(g);
    return g.joints.map((x) => ({
      id: x.id,
      engineAsksBolt: r.findings.some((f) => f.code === "fastener-not-recorded" && f.subject.id === x.id),
      editorNothingHere: jointCoverage(x, g.nodes, jointResult(r, x.id), true).state === "nothingHere",
    }));
  };
  it("in the base circuit no joint is both asked for a bolt and called nothing to check", () => {
    const v = verdicts(rudderCircuit());
    for (const id of ["overP", "thruF", "tbLa", "tbRa"]) expect(v.find((x) => x.id === id)).toMatchObject({ engineAsksBolt: false, editorNothingHere: true });
    expect(v.filter((x) => x.engineAsksBolt && x.editorNothingHere)).toEqual([]);
  });
  it("a cable's end on a pulley's pivot with no bolt: the check asks for the bolt and the editor does not call it nothing to check", () => {
    const g = onPivot();
    expect(verdicts(g).find((x) => x.id === "tbLa")).toMatchObject({ engineAsksBolt: true, editorNothingHere: false });
    expect(jointSort(g.joints.find((x) => x.id === "tbLa")!, g.nodes).sort).toBe("terminal");
  });
});
