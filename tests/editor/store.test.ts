import { beforeAll, describe, expect, it, vi } from "vitest";
import { createEditorStore, toGraph } from "@/editor/store";
import { diffGraphs } from "@/shared/review/diff";
import { emptyGraph, graphSchema, type LinkageGraph } from "@/shared/linkage/schema";
import { analyze } from "@/shared/analysis";
import type { Report } from "@/shared/analysis/types";
import { DEMO_WRONG_JOINT, demoPitchLinkage } from "@/shared/demo";
import { loadSchema } from "@/editor/store/schema";

// The cards load the graph schema before they show (editor/panels/Inspector.tsx); so do these tests.
beforeAll(() => loadSchema());

function counterIds() {
  let i = 0;
  return (kind: string) => `${kind}-${++i}`;
}

function make(graph: LinkageGraph = emptyGraph("Pitch", "pitch"), extra: Parameters<typeof createEditorStore>[1] = {}) {
  let t = 0;
  return createEditorStore(graph, { revision: 1, newId: counterIds(), now: () => (t += 10_000), ...extra });
}

/** stick → pushrod → bellcrank → pushrod → horn → surface, through store actions. */
function buildRun(store: ReturnType<typeof make>) {
  const s = () => store.getState();
  const stick = s().addNode("stick", { x: 0, y: 0 });
  const fwd = s().addNode("pushrod", { x: 200, y: 0 });
  const crank = s().addNode("bellcrank", { x: 400, y: 0 });
  const aft = s().addNode("pushrod", { x: 600, y: 0 });
  const horn = s().addNode("controlHorn", { x: 800, y: 0 });
  const j1 = s().connect({ node: stick, port: "attach" }, { node: fwd, port: "a" });
  const j2 = s().connect({ node: fwd, port: "b" }, { node: crank, port: "in" });
  const j3 = s().connect({ node: crank, port: "out" }, { node: aft, port: "a" });
  const j4 = s().connect({ node: aft, port: "b" }, { node: horn, port: "attach" });
  return { stick, fwd, crank, aft, horn, joints: [j1, j2, j3, j4] };
}

describe("editor store", () => {
  it("adds parts with valid default props and connects them; the graph passes the shared schema", () => {
    const store = make();
    const run = buildRun(store);
    const s = store.getState();
    expect(s.nodes.map((n) => n.kind)).toEqual(["stick", "pushrod", "bellcrank", "pushrod", "controlHorn"]);
    expect(run.joints.every((j) => j.ok)).toBe(true);
    expect(s.joints).toHaveLength(4);
    expect(s.nodes[1].label).toBe("Pushrod 1");
    expect(s.nodes[3].label).toBe("Pushrod 2");
    const parsed = graphSchema.safeParse(toGraph(s));
    expect(parsed.success).toBe(true);
    // The new joint is selected so its card opens.
    expect(s.selection.joints).toEqual([s.joints[3].id]);
  });

  it("refuses invalid connections with a reason and leaves the graph alone", () => {
    const store = make();
    const { stick, fwd, crank } = buildRun(store);
    const before = store.getState().joints;
    const s = store.getState();
    const wrongPort = s.connect({ node: stick, port: "in" }, { node: fwd, port: "a" });
    expect(wrongPort.ok).toBe(false);
    if (!wrongPort.ok) expect(wrongPort.reason).toMatch(/no "in" port/);
    const self = s.connect({ node: fwd, port: "a" }, { node: fwd, port: "b" });
    expect(self.ok).toBe(false);
    const dup = s.connect({ node: crank, port: "in" }, { node: fwd, port: "b" }); // same pair, reversed
    expect(dup.ok).toBe(false);
    const missing = s.connect({ node: "nope", port: "a" }, { node: fwd, port: "a" });
    expect(missing.ok).toBe(false);
    expect(store.getState().joints).toBe(before);
    expect(store.getState().notice?.text).toBeTruthy();
  });

  it("deleting a part removes its joints; undo brings both back, redo removes them again", () => {
    const store = make();
    const { crank } = buildRun(store);
    const full = store.getState();
    store.getState().select({ type: "node", id: crank });
    store.getState().deleteSelection();
    let s = store.getState();
    expect(s.nodes.find((n) => n.id === crank)).toBeUndefined();
    expect(s.joints).toHaveLength(2);
    expect(s.selection.nodes).toEqual([]);
    s.undo();
    s = store.getState();
    expect(s.nodes).toBe(full.nodes);
    expect(s.joints).toBe(full.joints);
    s.redo();
    expect(store.getState().joints).toHaveLength(2);
  });

  it("undo/redo round trip over every step returns to the exact same graphs", () => {
    const store = make();
    const states: LinkageGraph[] = [toGraph(store.getState())];
    const s = () => store.getState();
    const a = s().addNode("stick", { x: 0, y: 0 });
    states.push(toGraph(s()));
    const b = s().addNode("pushrod", { x: 100, y: 0 });
    states.push(toGraph(s()));
    s().connect({ node: a, port: "attach" }, { node: b, port: "a" });
    states.push(toGraph(s()));
    s().updateNode(b, { props: { material: "4130N", outsideDiameter: 0.625, wall: 0.035, length: 30 } });
    states.push(toGraph(s()));
    s().moveNodes([{ id: a, position: { x: 50, y: 60 } }]);
    states.push(toGraph(s()));
    for (let i = states.length - 2; i >= 0; i--) {
      s().undo();
      expect(toGraph(s())).toEqual(states[i]);
    }
    expect(s().past).toHaveLength(0);
    for (let i = 1; i < states.length; i++) {
      s().redo();
      expect(toGraph(s())).toEqual(states[i]);
    }
    expect(s().future).toHaveLength(0);
  });

  it("tracks dirty against the saved revision, including undo back to it", () => {
    const store = make();
    const s = () => store.getState();
    expect(s().dirty).toBe(false);
    const id = s().addNode("stick", { x: 0, y: 0 });
    expect(s().dirty).toBe(true);
    s().undo();
    expect(s().dirty).toBe(false);
    s().redo();
    expect(s().dirty).toBe(true);
    // A save in flight: the snapshot sent is what becomes clean; edits made meanwhile stay dirty.
    const sent = { nodes: s().nodes, joints: s().joints };
    s().moveNodes([{ id, position: { x: 30, y: 30 } }]);
    s().markSaved(2, sent);
    expect(s().revision).toBe(2);
    expect(s().dirty).toBe(true);
    s().markSaved(3);
    expect(s().dirty).toBe(false);
    s().undo(); // back before the move: differs from what was saved
    expect(s().dirty).toBe(true);
  });

  it("replaceGraph with a revision is a clean state with fresh history; without one it is an undoable edit", () => {
    const store = make();
    buildRun(store);
    const theirs = emptyGraph("Pitch", "pitch");
    store.getState().replaceGraph(theirs, { revision: 7 });
    let s = store.getState();
    expect(s.nodes).toEqual([]);
    expect(s.revision).toBe(7);
    expect(s.dirty).toBe(false);
    expect(s.past).toHaveLength(0);
    const imported = toGraph(make().getState());
    const other = make();
    buildRun(other);
    s.replaceGraph(toGraph(other.getState()));
    s = store.getState();
    expect(s.nodes).toHaveLength(5);
    expect(s.dirty).toBe(true);
    s.undo();
    expect(toGraph(store.getState()).nodes).toEqual(imported.nodes);
  });

  it("drag gestures record one undo step; moves alone do not rerun the engine", () => {
    let runs = 0;
    const fake = (g: LinkageGraph): Report => {
      runs++;
      return analyze(g);
    };
    const store = make(undefined, { analyze: fake, analysisDelay: 0 });
    const s = () => store.getState();
    const id = s().addNode("pushrod", { x: 0, y: 0 });
    const runsAfterAdd = runs;
    const pastLen = s().past.length;
    s().beginGesture();
    for (let i = 1; i <= 20; i++) s().moveNodes([{ id, position: { x: i * 5, y: 0 } }], { transient: true });
    s().endGesture();
    expect(s().past.length).toBe(pastLen + 1);
    expect(s().nodes[0].position).toEqual({ x: 100, y: 0 });
    expect(runs).toBe(runsAfterAdd);
    s().undo();
    expect(s().nodes[0].position).toEqual({ x: 0, y: 0 });
  });

  it("opens on the server's report without its engine, and fetches the engine once on the first change", async () => {
    const g = demoPitchLinkage();
    let loads = 0;
    const store = make(g, {
      analysisDelay: 0,
      initialReport: analyze(g),
      loadAnalyze: async () => { loads++; return analyze; },
    });
    const s = () => store.getState();
    expect(s().badgeBySubject[`joint:${DEMO_WRONG_JOINT}`]).toMatchObject({ worst: "hazard" }); // findings at once
    s().setSettings(s().settings); // the same settings: nothing to re-check
    s().select({ type: "node", id: "horn" });
    s().nudge(10, 0); // a move changes no number
    expect(loads).toBe(0);
    const j = s().joints.find((x) => x.id === DEMO_WRONG_JOINT)!;
    s().updateJointHardware(j.id, { ...j.hardware, jamNut: { fitted: true, tightened: true } });
    s().updateJointHardware(j.id, { ...j.hardware, jamNut: { fitted: true, tightened: true }, note: "fitted" });
    await vi.waitFor(() => expect((s().findingsBySubject[`joint:${DEMO_WRONG_JOINT}`] ?? []).some((f) => f.code === "jam-nut-missing")).toBe(false));
    expect(loads).toBe(1);
  });

  it("form edits are validated by the shared schema and coalesced into one step", () => {
    let t = 0;
    const store = createEditorStore(emptyGraph(), { newId: counterIds(), now: () => (t += 100) });
    const s = () => store.getState();
    const id = s().addNode("bellcrank", { x: 0, y: 0 });
    const past = s().past.length;
    expect(s().updateNode(id, { props: { inputArm: 3.5, outputArm: 3, armAngle: 90 } }, { coalesce: "f" }).ok).toBe(true);
    expect(s().updateNode(id, { props: { inputArm: 3.75, outputArm: 3, armAngle: 90 } }, { coalesce: "f" }).ok).toBe(true);
    expect(s().past.length).toBe(past + 1);
    const bad = s().updateNode(id, { props: { inputArm: -1, outputArm: 3, armAngle: 90 } });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.reason).toMatch(/input arm must be greater than 0/);
    expect((s().nodes[0].props as { inputArm: number }).inputArm).toBe(3.75);
  });

  it("joint hardware runs through the live engine: a rod end without a jam nut is flagged, fitting one clears it", () => {
    const store = make(emptyGraph("Pitch", "pitch"), { analyze, analysisDelay: 0 });
    const { joints } = buildRun(store);
    const j = joints[1];
    if (!j.ok) throw new Error("connect failed");
    const rodEnd = { shank: "male", thread: "1/4-28", hand: "RH", ballBore: 0.25, ratedUltimate: 3000, hasWitnessHole: true };
    store.getState().updateJointHardware(j.value, { rodEnd, engagement: { witnessHoleVerified: true } });
    const codes = () => (store.getState().findingsBySubject[`joint:${j.value}`] ?? []).map((f) => f.code);
    const before = codes();
    expect(before.some((c) => /jam/i.test(c))).toBe(true);
    expect(store.getState().worstByJoint[j.value]).toBeDefined();
    store.getState().updateJointHardware(j.value, { rodEnd, engagement: { witnessHoleVerified: true }, jamNut: { fitted: true, tightened: true } });
    expect(codes().some((c) => /jam/i.test(c))).toBe(false);
  });

  it("duplicate and copy/paste clone parts and the joints among them with fresh ids", () => {
    const store = make();
    const { stick, fwd } = buildRun(store);
    const s = () => store.getState();
    s().setSelection({ nodes: [stick, fwd], joints: [] });
    s().duplicate();
    expect(s().nodes).toHaveLength(7);
    expect(s().joints).toHaveLength(5);
    expect(s().selection.nodes).toHaveLength(2);
    const [c1] = s().selection.nodes;
    expect(s().nodes.find((n) => n.id === c1)!.position).toEqual({ x: 40, y: 40 });
    s().copy();
    s().paste();
    expect(s().nodes).toHaveLength(9);
    expect(s().joints).toHaveLength(6);
    expect(graphSchema.safeParse(toGraph(s())).success).toBe(true);
  });

  it("nudges the selection, and read-only stores refuse every change", () => {
    const store = make();
    const id = store.getState().addNode("stick", { x: 10, y: 10 });
    store.getState().nudge(10, -10);
    expect(store.getState().nodes[0].position).toEqual({ x: 20, y: 0 });
    const ro = createEditorStore(toGraph(store.getState()), { readOnly: true });
    ro.getState().addNode("pushrod", { x: 0, y: 0 });
    ro.getState().select({ type: "node", id });
    ro.getState().deleteSelection();
    ro.getState().nudge(10, 0);
    expect(ro.getState().nodes).toHaveLength(1);
    expect(ro.getState().nodes[0].position).toEqual({ x: 20, y: 0 });
    expect(ro.getState().selection.nodes).toEqual([id]); // selecting still works
    expect(ro.getState().dirty).toBe(false);
  });

  it("history is bounded", () => {
    const store = make(undefined, { historyLimit: 5 });
    for (let i = 0; i < 12; i++) store.getState().addNode("pushrod", { x: i * 10, y: 0 });
    expect(store.getState().past).toHaveLength(5);
  });

  it("summarises the difference between two graphs by name", () => {
    const a = make();
    buildRun(a);
    const mine = { nodes: a.getState().nodes, joints: a.getState().joints };
    a.getState().addNode("controlSurface", { x: 0, y: 0 });
    a.getState().updateNode(mine.nodes[0].id, { label: "Left stick" });
    const theirs = { nodes: a.getState().nodes, joints: a.getState().joints.slice(1) };
    // The conflict dialog's difference: mine → theirs, by name (shared/review/diff.ts).
    const d = diffGraphs(mine, theirs);
    expect(d.nodes.added.map((n) => n.name)).toEqual(["Control surface 1"]);
    expect(d.nodes.changed.map((n) => n.name)).toEqual(["Left stick"]);
    expect(d.joints.removed).toHaveLength(1);
    expect(d.joints.removed[0].name).toBe("Control stick 1, attach ↔ Pushrod 1 A");
  });
});

describe("starting values (a part's unentered props)", () => {
  const node = (store: ReturnType<typeof make>, id: string) => store.getState().nodes.find((n) => n.id === id)!;
  it("a placed part has all its starting values marked; values supplied with it are not", () => {
    const store = make();
    const rod = store.getState().addNode("pushrod", { x: 0, y: 0 });
    expect(node(store, rod).unentered).toEqual(["material", "outsideDiameter", "wall", "length"]);
    const fromLibrary = store.getState().addNode("pushrod", { x: 0, y: 100 }, { props: { material: "6061-T6", outsideDiameter: 0.75, wall: 0.049 } });
    expect(node(store, fromLibrary).unentered).toEqual(["length"]);
    // A mount's note is not a value a check uses: nothing marked.
    expect(node(store, store.getState().addNode("structureMount", { x: 0, y: 200 })).unentered).toBeUndefined();
    expect(graphSchema.safeParse(toGraph(store.getState())).success).toBe(true);
  });

  it("changing a value clears only its mark; the same value again, or a hair off from unit conversion, does not", () => {
    const store = make();
    const s = () => store.getState();
    const rod = s().addNode("pushrod", { x: 0, y: 0 });
    const props = { ...node(store, rod).props };
    expect(s().updateNode(rod, { props: { ...props, outsideDiameter: 0.625 } }).ok).toBe(true);
    expect(node(store, rod).unentered).toEqual(["material", "wall", "length"]);
    expect(s().updateNode(rod, { props: { ...node(store, rod).props, length: 36 * (1 + 1e-12) } }).ok).toBe(true);
    expect(node(store, rod).unentered).toEqual(["material", "wall", "length"]);
    expect(s().updateNode(rod, { label: "Aft rod" }).ok).toBe(true);
    expect(node(store, rod).unentered).toEqual(["material", "wall", "length"]);
    // Every value changed: the field goes.
    expect(s().updateNode(rod, { props: { material: "6061-T6", outsideDiameter: 0.625, wall: 0.049, length: 30 } }).ok).toBe(true);
    expect(node(store, rod).unentered).toBeUndefined();
  });

  it("confirming keeps the values, clears some or all marks, and is one undo step", () => {
    const store = make();
    const s = () => store.getState();
    const crank = s().addNode("bellcrank", { x: 0, y: 0 });
    const before = { ...node(store, crank).props };
    expect(s().confirmValues(crank, ["armAngle"]).ok).toBe(true);
    expect(node(store, crank).unentered).toEqual(["inputArm", "outputArm"]);
    expect(s().confirmValues(crank).ok).toBe(true);
    expect(node(store, crank).unentered).toBeUndefined();
    expect(node(store, crank).props).toEqual(before);
    s().undo();
    expect(node(store, crank).unentered).toEqual(["inputArm", "outputArm"]);
    // The check reads them: unentered arms give the crank a finding, confirmed ones none.
    const codes = () => analyze(toGraph(s())).findings.filter((f) => f.code === "values-unentered" && f.subject.id === crank).length;
    expect(codes()).toBe(1);
    s().confirmValues(crank);
    expect(codes()).toBe(0);
  });

  it("a read-only linkage refuses to confirm; copies keep the marks", () => {
    const store = make();
    const s = () => store.getState();
    const stick = s().addNode("stick", { x: 0, y: 0 });
    const ro = createEditorStore(toGraph(s()), { readOnly: true });
    expect(ro.getState().confirmValues(stick).ok).toBe(false);
    expect(ro.getState().nodes[0].unentered).toEqual(node(store, stick).unentered);
    s().duplicate();
    const copy = s().nodes.find((n) => n.id !== stick)!;
    expect(copy.unentered).toEqual(node(store, stick).unentered);
  });
});
