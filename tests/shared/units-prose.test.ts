/** Findings' prose in the reader's units (shared/units.ts measuresInText): the engine writes US customary. */
import { describe, expect, it } from "vitest";
import { measuresInText } from "@/shared/units";

describe("measures in a finding's text", () => {
  it("US text is unchanged", () => {
    const t = "The bolt carries 960 lbf at 0.250 in, torque 20–25 in·lbf.";
    expect(measuresInText(t, "US")).toBe(t);
  });
  it("lengths, forces, torques, areas and stresses convert by the exact factors (25.4 mm, 4.4482216152605 N)", () => {
    expect(measuresInText("0.438 in across the ball but the housing bore is 0.500 in.", "SI")).toBe("11.1 mm across the ball but the housing bore is 12.7 mm.");
    expect(measuresInText("carries 1,000 lbf ultimate", "SI")).toBe("carries 4,448 N ultimate");
    expect(measuresInText("A_t 0.0364 in² × Ftu 125 ksi", "SI")).toBe("A_t 23.5 mm² × Ftu 861.8 MPa");
    expect(measuresInText("at 40 in·lbf, below", "SI")).toBe("at 4.52 N·m, below");
  });
  it("a range converts both ends, and a temperature goes to °C", () => {
    expect(measuresInText("the range 20–25 in·lbf applies", "SI")).toBe("the range 2.26–2.82 N·m applies");
    expect(measuresInText("measured at 100 °F and at −20 °F", "SI")).toBe("measured at 37.8 °C and at −28.9 °C");
  });
  it("a part's quoted name, a thread size, a bolt size and words after a number are left alone", () => {
    expect(measuresInText('"Rudder 3 in front" carries 100 lbf', "SI")).toBe('"Rudder 3 in front" carries 444.8 N');
    expect(measuresInText("a 1/4-28 thread on an AN4 bolt, 5 threads showing", "SI")).toBe("a 1/4-28 thread on an AN4 bolt, 5 threads showing");
    expect(measuresInText("2 inches and 3 lbfx", "SI")).toBe("2 inches and 3 lbfx");
  });
});
