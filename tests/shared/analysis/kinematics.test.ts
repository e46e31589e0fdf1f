import { describe, expect, it } from "vitest";
import { fourBarFindings, solveFourBar, sweepFourBar, transmissionAngle } from "@/shared/analysis";

const bar = { a: 40, b: 120, c: 80, d: 100 }; // mechanism-design textbook worked example (from memory)

describe("four-bar loop closure (domain.md §5)", () => {
  it("matches the worked example at θ2 = 40°, open branch", () => {
    const p = solveFourBar(bar, 40, "open")!;
    expect(p.theta3).toBeCloseTo(20.3, 1); // θ3 = 20.30° (from memory)
    expect(Math.abs(p.theta4 - 57.33)).toBeLessThan(0.02); // θ4 = 57.33° (from memory)
  });
  it.each([0, 40, 95, 180, 270])("closes the vector loop at θ2 = %s° on both branches", (t2) => {
    for (const branch of ["open", "crossed"] as const) {
      const p = solveFourBar(bar, t2, branch)!;
      const r = Math.PI / 180;
      // a·e^{iθ2} + b·e^{iθ3} − c·e^{iθ4} − d = 0 (loop closure, statics of position)
      const x = bar.a * Math.cos(t2 * r) + bar.b * Math.cos(p.theta3 * r) - bar.c * Math.cos(p.theta4 * r) - bar.d;
      const y = bar.a * Math.sin(t2 * r) + bar.b * Math.sin(p.theta3 * r) - bar.c * Math.sin(p.theta4 * r);
      expect(Math.hypot(x, y)).toBeLessThan(1e-9);
    }
  });
  it("the transmission angle is the angle between coupler and rocker", () => {
    const p = solveFourBar(bar, 40, "open")!;
    expect(p.transmission).toBeCloseTo(57.33 - 20.3, 1); // 37.0°: θ4 − θ3 from the worked example
    expect(transmissionAngle(10, 350)).toBeCloseTo(20, 12);
    expect(transmissionAngle(0, 200)).toBeCloseTo(160, 12);
  });
  it("returns null where the links cannot close", () => {
    // a = 60 crank with b + c − d = 10: the input cannot reach θ2 = 180°, links too short to close
    expect(solveFourBar({ a: 60, b: 30, c: 30, d: 50 }, 180)).toBeNull();
  });
});

describe("travel sweep", () => {
  it("flags the worked example's poor transmission near θ2 = 40° (37° < 40°)", () => {
    const s = sweepFourBar(bar, 0, 60, 30);
    expect(s.minTransmission).toBeLessThan(40); // mechanism-design texts: keep 40°–140°
    expect(s.poorTransmission).toBe(true);
    expect(fourBarFindings({ type: "node", id: "x" }, s).map((f) => f.code)).toEqual(["transmission-angle-poor"]);
  });
  it("passes a parallelogram-like rocker pair over ±20°", () => {
    // a = c = 3, b = d = 20, θ2 = 90° ± 20°: a parallelogram, θ3 = 0, θ4 = θ2, so μ = θ2 = 70°–110°, inside 40°–140° (mechanism-design texts)
    const s = sweepFourBar({ a: 3, b: 20, c: 3, d: 20 }, 70, 110, 40);
    expect(s.toggles).toBe(false);
    expect(s.poorTransmission).toBe(false);
    expect(s.minTransmission).toBeGreaterThan(65);
    expect(fourBarFindings({ type: "node", id: "x" }, s)).toEqual([]);
  });
  it("flags toggle when the travel goes beyond where the chain can be assembled", () => {
    const s = sweepFourBar({ a: 60, b: 30, c: 30, d: 50 }, 0, 180, 36);
    expect(s.toggles).toBe(true);
    expect(fourBarFindings({ type: "node", id: "x" }, s)[0].code).toBe("linkage-toggles");
    expect(fourBarFindings({ type: "node", id: "x" }, s)[0].severity).toBe("hazard");
  });
});
