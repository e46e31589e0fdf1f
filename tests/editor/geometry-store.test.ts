import { describe, expect, it } from "vitest";
import { createEditorStore, toGraph } from "@/editor/store";
import { demoPitchLinkage } from "@/shared/demo";
import { demoPitchGeometry } from "@/shared/demo-geometry";
import { turningParts, rodLinks, armEnd } from "@/editor/geometry/model";
import { chartRows } from "@/editor/geometry/MotionCharts";
import { DEFAULT_SETTINGS, sweepGraph } from "@/shared/analysis";

describe("the editor store keeps the linkage geometry", () => {
  it("a graph without geometry saves without it; setting one marks the graph unsaved and saves it", () => {
    const store = createEditorStore(demoPitchLinkage(), { revision: 1 });
    expect("geometry" in toGraph(store.getState())).toBe(false);
    store.getState().setGeometry(demoPitchGeometry());
    expect(store.getState().dirty).toBe(true);
    expect(toGraph(store.getState()).geometry?.parts.horn.pivot.x).toBe(122);
    const snap = { nodes: store.getState().nodes, joints: store.getState().joints, geometry: store.getState().meta.geometry };
    store.getState().markSaved(2, snap);
    expect(store.getState().dirty).toBe(false);
  });
  it("a geometry change made while a save is in flight stays unsaved", () => {
    const store = createEditorStore(demoPitchLinkage(), { revision: 1 });
    store.getState().setGeometry(demoPitchGeometry());
    const snap = { nodes: store.getState().nodes, joints: store.getState().joints, geometry: store.getState().meta.geometry };
    store.getState().setGeometry({ ...demoPitchGeometry(), datum: "moved" });
    store.getState().markSaved(2, snap);
    expect(store.getState().dirty).toBe(true);
  });
  it("loading the server's graph takes its geometry as saved", () => {
    const store = createEditorStore(demoPitchLinkage(), { revision: 1 });
    store.getState().replaceGraph({ ...demoPitchLinkage(), geometry: demoPitchGeometry() }, { revision: 3 });
    expect(store.getState().meta.geometry?.datum).toBe("firewall face, top longeron");
    expect(store.getState().dirty).toBe(false);
  });
});

describe("the geometry view's model", () => {
  it("lists the turning parts with their arm lengths and each rod's two ends", () => {
    const g = demoPitchLinkage();
    expect(turningParts(g.nodes).map((p) => [p.id, p.arms.map((a) => `${a.port}:${a.length}`).join(",")])).toEqual([
      ["stick", "attach:6,grip:20"], ["bellcrank", "in:3,out:4"], ["horn", "attach:5"],
    ]);
    const rods = rodLinks(g);
    expect(rods.find((r) => r.id === "pushrod-aft")).toMatchObject({ a: { node: "bellcrank", port: "out" }, b: { node: "horn", port: "attach" } });
    // The bellcrank's out arm, 4 in straight up from (50, −3), turned 90° counter-clockwise points to −x.
    const e = armEnd(demoPitchGeometry(), turningParts(g.nodes)[1], "out", 90)!;
    expect(e.x).toBeCloseTo(46, 9);
    expect(e.y).toBeCloseTo(-3, 9);
  });
  it("charts at most ~240 points of a long sweep and says so", () => {
    const m = sweepGraph({ ...demoPitchLinkage(), geometry: demoPitchGeometry() }, DEFAULT_SETTINGS, 2000);
    const { rows, every } = chartRows(m.sweeps[0]);
    expect(every).toBe(9);
    expect(rows.length).toBeLessThanOrEqual(240);
    expect(rows[0].input).toBe(-15);
  });
});
