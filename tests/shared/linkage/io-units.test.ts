import { describe, expect, it } from "vitest";
import { parseLinkageFile, serializeLinkage } from "@/shared/linkage/io";
import { demoPitchLinkage } from "@/shared/demo";
import { formatQuantity, inLbfToNm, inToMm, lbfToN, mpaToPsi, nToLbf, psiToMPa } from "@/shared/units";

describe("linkage file import/export", () => {
  it("round-trips the demo", () => {
    const text = serializeLinkage(demoPitchLinkage());
    const r = parseLinkageFile(text);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.graph).toEqual(demoPitchLinkage());
    expect(text.startsWith('{\n  "formatVersion": 1,')).toBe(true);
  });
  it("rejects text that is not JSON", () => {
    const r = parseLinkageFile("{ nope");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0].path).toBe("");
  });
  it("gives the path of a bad field", () => {
    const g = JSON.parse(serializeLinkage(demoPitchLinkage()));
    g.nodes[2].props.inputArm = 0;
    g.joints[1].to.port = "c";
    const r = parseLinkageFile(JSON.stringify(g));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.map((e) => e.path).sort()).toEqual(["joints[1].to.port", "nodes[2].props.inputArm"]);
  });
  it("rejects another format version", () => {
    const r = parseLinkageFile(JSON.stringify({ ...demoPitchLinkage(), formatVersion: 2 }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]).toEqual({ path: "formatVersion", message: "formatVersion must be 1" });
  });
});

describe("units by exact factors (NIST SP 811)", () => {
  it("converts force, length, torque and stress", () => {
    expect(lbfToN(1)).toBeCloseTo(4.4482216152605, 12); // domain.md: 1 lbf = 4.4482216152605 N exactly
    expect(nToLbf(4.4482216152605)).toBeCloseTo(1, 12);
    expect(inToMm(1)).toBeCloseTo(25.4, 12); // 1 in = 25.4 mm exactly (international inch)
    expect(inLbfToNm(1)).toBeCloseTo(4.4482216152605 * 0.0254, 12); // 0.112985 N·m
    expect(psiToMPa(1)).toBeCloseTo(4.4482216152605 / 0.0254 ** 2 / 1e6, 12); // lbf/in² → N/mm²
    expect(mpaToPsi(psiToMPa(95000))).toBeCloseTo(95000, 6);
  });
  it("formats a quantity in the user's system", () => {
    expect(formatQuantity(167, "force", "US")).toBe("167.0 lbf");
    expect(formatQuantity(167, "force", "SI")).toBe("742.9 N"); // 167 × 4.44822 = 742.85 N
    expect(formatQuantity(2126, "force", "US")).toBe("2,126 lbf");
    expect(formatQuantity(60, "torque", "SI")).toBe("6.78 N·m"); // 60 × 0.112985 = 6.779 N·m
    expect(formatQuantity(0.25, "length", "SI")).toBe("6.35 mm");
    expect(formatQuantity(0.0364, "length", "US", 4)).toBe("0.0364 in");
  });
});
