/**
 * What a part's card, the run list and the canvas say the live check covers at a part (editor/nodes/coverage.ts):
 * "no findings" only where the part itself was checked (a pushrod's margins, a cable's margin, a driven
 * surface's hinge moment, a turnbuckle's, pulley's or fairlead's rules); a bellcrank, a structure mount or a stop
 * is "checked at its joints" at most; a part with nothing computed is "not checked", one with starting values
 * "values to enter".
 */
import { beforeAll, describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { analyze } from "@/shared/analysis";
import { demoPitchLinkage } from "@/shared/demo";
import { demoRudderLinkage } from "@/shared/demo-rudder";
import type { LinkageGraph } from "@/shared/linkage/schema";
import { partCoverage } from "@/editor/nodes/coverage";
import { partAccessibleName } from "@/editor/a11y";
import { createEditorStore } from "@/editor/store";
import { EditorConfigContext, EditorStoreContext } from "@/editor/context";
import { loadSchema } from "@/editor/store/schema";
import { RunList } from "@/editor/panels/RunList";
import { NodeInspector } from "@/editor/panels/Cards";

beforeAll(() => loadSchema());

function coverageOf(g: LinkageGraph, id: string) {
  const report = analyze(g);
  const n = g.nodes.find((x) => x.id === id)!;
  const findings = report.findings.filter((f) => f.subject.type === "node" && f.subject.id === id);
  return { c: partCoverage(n, g.joints, g.nodes, report), findings };
}

describe("partCoverage", () => {
  it("a pushrod whose margins were computed, a driven surface, a cable with its margin: 'no findings'", () => {
    const pitch = demoPitchLinkage();
    for (const id of ["pushrod-fwd", "pushrod-aft", "elevator"]) {
      const { c, findings } = coverageOf(pitch, id);
      expect(findings).toHaveLength(0);
      expect(c).toMatchObject({ state: "checked", short: "no findings" });
      expect(c.text).toMatch(/^No findings here from the live check: /);
    }
    expect(coverageOf(pitch, "pushrod-aft").c.text).toContain("margins in compression and in tension were computed");
    const yaw = demoRudderLinkage();
    expect(coverageOf(yaw, "rd-cable-left").c).toMatchObject({ state: "checked", text: expect.stringContaining("strength margin was computed") });
    expect(coverageOf(yaw, "rd-pulley").c.state).toBe("checked");
  });

  it("a pulley whose cable's size is still a starting value is not called checked (its groove is not judged)", () => {
    const yaw = demoRudderLinkage();
    for (const n of yaw.nodes) if (n.kind === "cable") n.unentered = ["size"] as never;
    expect(coverageOf(yaw, "rd-pulley").c.state).not.toBe("checked");
  });

  it("a bellcrank, a structure mount, a stop, a stick: checked at their joints only — never 'no findings'", () => {
    const pitch = demoPitchLinkage();
    for (const id of ["bellcrank", "mount-tail", "stop-stick", "stick", "horn"]) {
      const { c, findings } = coverageOf(pitch, id);
      expect(findings).toHaveLength(0);
      expect(c.state).toBe("atJoints");
      expect(c.short).toBe("checked at its joints");
      expect(c.text).toMatch(/^Checked at its joints only: \d+ checks were made there \(see the joint cards\)\. The live check makes no check of this part itself\.$/);
    }
  });

  it("a part with nothing computed at it or its joints is 'not checked'", () => {
    const g = demoPitchLinkage();
    // A stop whose joint has no hardware: no check at its joint, none of its own.
    const j = g.joints.find((x) => x.id === "j-stick-stop")!;
    j.hardware = { torqueStripe: false, photos: [], note: "" };
    const { c } = coverageOf(g, "stop-stick");
    expect(c).toMatchObject({ state: "notChecked", short: "not checked" });
    expect(c.text).toMatch(/^Not checked: the live check makes no check of this part itself/);
    // A lone structure mount.
    g.nodes.push({ id: "lone", kind: "structureMount", label: "Spare bracket", position: { x: 0, y: 0 }, props: { note: "" } } as never);
    expect(coverageOf(g, "lone").c.state).toBe("notChecked");
  });

  it("a pushrod no input drives: its margins are not computed, and it says why", () => {
    const g = demoPitchLinkage();
    const rod = structuredClone(g.nodes.find((n) => n.id === "pushrod-aft")!);
    rod.id = "spare-rod";
    rod.label = "Spare pushrod";
    g.nodes.push(rod);
    const { c } = coverageOf(g, "spare-rod");
    expect(c.state).toBe("notChecked");
    expect(c.text).toMatch(/^Not checked: its margins are not computed/);
  });

  it("a part with values still at their starting values: 'values to enter'; before the first run: 'not checked yet'", () => {
    const g = demoPitchLinkage();
    const bc = g.nodes.find((n) => n.id === "bellcrank")!;
    bc.unentered = ["inputArm", "outputArm"] as never;
    const { c } = coverageOf(g, "bellcrank");
    expect(c).toMatchObject({ state: "toEnter", short: "values to enter" });
    expect(c.text).toBe("Not checked yet: 2 values are still the starting values (below).");
    expect(partCoverage(bc, g.joints, g.nodes, null)).toMatchObject({ state: "pending", short: "not checked yet" });
  });

  it("the canvas's spoken name says the same", () => {
    const g = demoPitchLinkage();
    const r = analyze(g);
    const name = (id: string, toEnter = 0) => {
      const n = g.nodes.find((x) => x.id === id)!;
      return partAccessibleName(n, undefined, toEnter, partCoverage(n, g.joints, g.nodes, r).short);
    };
    expect(name("mount-tail")).toBe("Structure mount, Stabilizer rear spar, no findings, checked at its joints");
    expect(name("pushrod-aft")).toBe("Pushrod, Aft pushrod, no findings");
    expect(partAccessibleName({ kind: "bellcrank", label: "" }, undefined, 2, "values to enter")).toBe("Bellcrank, no findings, 2 values to enter");
    expect(partAccessibleName({ kind: "bellcrank", label: "" }, { worst: "hazard", count: 1 }, 0, "not checked")).toBe("Bellcrank, 1 hazard");
  });
});

describe("the run list and the part's card", () => {
  /** A store opened on the demo, the live check run; a server render reads getInitialState, so that is its state now. */
  function store() {
    const g = demoPitchLinkage();
    const s = createEditorStore(g, { analyze, analysisDelay: 0, now: () => 0 });
    expect(s.getState().report).not.toBeNull();
    return { ...s, getInitialState: s.getState };
  }
  const wrap = (s: ReturnType<typeof store>, child: React.ReactElement) =>
    renderToStaticMarkup(
      createElement(EditorConfigContext.Provider, { value: { unitSystem: "US", readOnly: false } },
        createElement(EditorStoreContext.Provider, { value: s }, child)),
    );
  /** The coverage word of a run-list row. */
  function rowCoverage(html: string, key: string): string {
    const m = new RegExp(`data-run-item="${key}"[\\s\\S]*?data-coverage="([a-zA-Z]+)"[^>]*>([^<]*)<`).exec(html);
    if (!m) throw new Error(`no row ${key}`);
    return `${m[1]}: ${m[2]}`;
  }

  it("a part row says what was checked, as a joint row does", () => {
    const html = wrap(store(), createElement(RunList, { onOpen: () => {} }));
    expect(rowCoverage(html, "node:stop-stick")).toBe("atJoints: checked at its joints");
    expect(rowCoverage(html, "node:mount-tail")).toBe("atJoints: checked at its joints");
    expect(rowCoverage(html, "node:pushrod-aft")).toBe("checked: no findings");
  });

  it("the card of a part checked only at its joints has no green all-clear", () => {
    const s = store();
    const mount = wrap(s, createElement(NodeInspector, { id: "mount-tail" }));
    expect(mount).toMatch(/data-coverage="atJoints"[^>]*>Checked at its joints only/);
    expect(mount).not.toContain("bg-ok/10");
    const rod = wrap(s, createElement(NodeInspector, { id: "pushrod-aft" }));
    expect(rod).toMatch(/data-coverage="checked"[^>]*>No findings here from the live check: its margins/);
  });
});
