/**
 * A joint card's "unset, …" hint (editor/panels/specs.ts `unsetHint`) says what leaving a field unset means, so it
 * is shown only while the field is unset: under a set thread hand, nut pattern, bolt material, fit or shear it
 * would tell the builder a check is not made when it is. Rendered to static markup (the pure project has no DOM).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { SchemaForm } from "@/editor/panels/SchemaForm";
import { HARDWARE_SECTIONS } from "@/editor/panels/specs";
import { loadSchema } from "@/editor/store/schema";
import { hardwareSchema } from "@/shared/linkage/schema";
import { demoPitchLinkage } from "@/shared/demo";

beforeAll(() => loadSchema());

const UNSET = HARDWARE_SECTIONS.flatMap((s) => s.fields).filter((f) => f.type === "enum" && f.unsetHint);
const render = (hardware: Record<string, unknown>) =>
  renderToStaticMarkup(createElement(SchemaForm, { schema: hardwareSchema, sections: HARDWARE_SECTIONS, value: hardware, unitSystem: "US", onValid: () => {}, testId: "jf" }));
const keyOf = (path: string) => path.replace(/\./g, "__");

describe("unset hints on the joint card", () => {
  it("every 'unset, …' hint of the joint card is one shown only while unset", () => {
    expect(UNSET.map((f) => f.path).sort()).toEqual(["bolt.material", "fit", "nut.pattern", "rodEnd.hand", "shear"]);
    for (const f of HARDWARE_SECTIONS.flatMap((s) => s.fields)) expect(f.hint ?? "").not.toMatch(/^unset/);
  });

  it("is shown under the field while it is unset", () => {
    const j = demoPitchLinkage().joints.find((x) => x.id === "j-fwd-bellcrank")!;
    const h = structuredClone(j.hardware) as Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any
    delete h.rodEnd.hand; delete h.bolt.material; delete h.nut.pattern; delete h.fit; delete h.shear;
    const html = render(h);
    for (const f of UNSET) expect(html, f.path).toContain(`data-testid="jf-${keyOf(f.path)}-unset"`);
    expect(html).toContain("unset, the torque is not judged against a range");
  });

  it("is not shown under a field that is set", () => {
    const j = demoPitchLinkage().joints.find((x) => x.id === "j-fwd-bellcrank")!;
    const h = structuredClone(j.hardware) as Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any
    Object.assign(h.rodEnd, { hand: "LH" });
    Object.assign(h.bolt, { material: "steel" });
    Object.assign(h.nut, { pattern: "tension" });
    Object.assign(h, { fit: "clamped", shear: "double" });
    const html = render(h);
    for (const f of UNSET) expect(html, f.path).not.toContain(`data-testid="jf-${keyOf(f.path)}-unset"`);
    expect(html).not.toMatch(/unset, /);
  });
});
