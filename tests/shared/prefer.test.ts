/** Reading the Prefer request header (RFC 7240 §2: comma-separated preferences, parameters after `;`). */
import { describe, expect, it } from "vitest";
import { prefersMinimal } from "@/shared/prefer";

describe("prefersMinimal", () => {
  it("finds return=minimal among other preferences, in any case and spacing, with parameters", () => {
    for (const h of ["return=minimal", "respond-async, return=minimal", "RETURN = Minimal", "return=minimal; foo=bar", "wait=5,return=minimal", 'return="minimal"', "return=minimal, return=representation"]) expect(prefersMinimal(h)).toBe(true);
  });
  it("does not take another preference or a look-alike for it", () => {
    for (const h of [null, "", "return=representation", "return=minimalist", "respond-async", "x-return=minimal", "return=representation, return=minimal"]) expect(prefersMinimal(h)).toBe(false);
  });
});
