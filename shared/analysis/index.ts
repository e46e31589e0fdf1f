/**
 * The load-path check: analyze(graph, settings) → Report. Pure: no I/O, imports only from shared/.
 * Runs in the browser (live) and on the server (on save and POST /api/analyze) with the same numbers.
 * One indexed pass builds the adjacency; each check then runs in a single pass over nodes or joints.
 */
import type { LinkageGraph } from "../linkage/schema";
import { DEFAULT_SETTINGS, settingsSchema, type AnalysisSettings, type Finding, type JointResult, type PushrodResult, type Report, type SurfaceResult } from "./types";
import { buildContext } from "./context";
import { propagate } from "./loads";
import { marginOfSafety, pushrodResult, strengthFindings, UNDRIVEN_TODO } from "./allowables";
import { jointResult } from "./joints/result";
import { HINGE_BEARING_FACTOR, type FactorOptions } from "./joints/factors";
import { jointFindings } from "./joints/findings";
import { pathLoads } from "./joints/path";
import { hingeMomentCase, maxLoads, settingsCautions } from "./design-case";
import { secondaryInputFindings } from "./secondary";
import { retentionFindings } from "./retention";
import { structureFindings } from "./structure";
import { sortFindings, summarize } from "./report";
import { finding, linkageSubject } from "./format";
import { analyzeMotion, type MotionReport, type WorstLoad } from "./motion";
import { cableContext } from "./cable-circuits";
import { cableFindings, cableResults } from "./cables";
import { enterTodo, unenteredFindings, unenteredLoadKeys } from "./unentered";

export * from "./types";
export { solveFourBar, sweepFourBar, fourBarFindings, transmissionAngle, TRANSMISSION_MIN, TRANSMISSION_MAX } from "./kinematics";
export type { FourBar, FourBarPosition, SweepResult, Branch } from "./kinematics";
export { columnAllowable, eulerLoad, johnsonLoad, tubeSection, transitionSlenderness, marginOfSafety, specialFactor, boltDiameter, MARGIN_CAP } from "./allowables";
export { designForce, bellcrankPivotLoad, DUAL_CONTROL_SHARE } from "./loads";
export { analyzeMotion, sweepGraph, MOTION_NOT_CHECKED, atInput, type MotionReport, type MotionChainSummary, type WorstLoad, type ChainSweep, type MotionResult } from "./motion";
export { selectSpecialFactor, turnsOnBolt, HINGE_BEARING_FACTOR, CABLE_JOINT_FACTOR, type FactorOptions } from "./joints/factors";
export { HINGE_MOMENT_FACTOR } from "./design-case";

export const ENGINE_VERSION = "2.5.1"; // 2.5.1: which cable joints need no bolt is one definition shared with the editor (shared/linkage/contacts.ts) — only a guide's cable port and a cable's terminal in a turnbuckle; a cable's end on a pulley's pivot is asked for its bolt. 2.5.0 (an inspector's review): bolt bending is not computed without a recorded shear case; a rod end at a hinge, treated as a plain bearing, is rated against the hinge's 6.67; a rod end or moving joint with no bolt or pin lists its fastener as not checked (fastener-not-recorded); a stop's bolt is checked at its holes; a lock washer in the run is a hazard; a rigged cable circuit under the hinge-moment case is loaded from the scaled pilot force; an undriven cable has no margin; an unrated pulley is a caution; the assumptions name what is not checked (pushrod end fittings, a wheel's 1.25 × tangential force). 2.4.2: a self-locking nut below its minimum breakaway torque is a hazard (it no longer locks), not a caution. 2.4.1: a rod end with a witness hole needs the wire check (a recorded length no longer passes it); a castellated nut past the torque range is a caution (AC 43.13-1B 7-40f: change the washer or nut), not an accepted practice; torque figures with drag labelled so; a hinge's rod-end rating names its bearing factor; the assumptions state the factors from the build's settings. 2.4: control sense of roll runs (with the aileron's wing recorded) and yaw runs (with the pushed pedal recorded) from the geometry; `sense` carries its axis. 2.3: control sense of pitch runs from the geometry (motion chains carry `sense`); a hinge is checked with the designer's hinge load added, not checked without it. 2.1: starting values (unentered) are not used for margins; pushrod margins may be null. 2.1.1: an unrecorded rod-end hand is not taken as RH; no lever-rule force from a starting grip arm. 2.2: torque maximum with drag, retaining-washer side asked, undriven parts not checked, link ends turn on their bolt, trim cables, swept surface travel against the card, dual-control sweeps keep the full-force case, wheel minimums

export const NOTICE =
  "Linkwright's numbers are an aid to the builder's own engineering and the designer's data, not a substitute. " +
  "Follow the kit or plans designer's instructions, the applicable airworthiness regulations and the judgement of a qualified inspector; defer to local rules and licensed practice.";

/** Stands in the list for the factor line, which is written from the build's own settings (factorAssumption). */
const FACTOR_LINE = "\u0000factors";

/** The factors the report used, as the build's settings set them (the published values unless the owner changed them). */
export function factorAssumption(s: AnalysisSettings): string {
  const f = (x: number) => String(Number(x.toFixed(2)));
  return `Ultimate = limit × ${f(s.ultimateFactor)} ultimate factor (14 CFR 23.303); every joint check also × the ${f(s.fittingFactor)} fitting factor (14 CFR 23.625). ` +
    `Bearing at a hole takes the joint's highest special factor instead (14 CFR 23.619): ${f(s.bearingFactor)} where a part turns on a plain bearing (23.693)` +
    `${s.bearingFactorOnRodEnds ? ", rod ends included (this build treats them as plain bearings)" : "; rod ends are taken as rolling bearings and rated by their makers"}, ` +
    `${f(s.cableFactor)} on joints of cable systems (23.693), ${HINGE_BEARING_FACTOR} at hinges without ball or roller bearings (23.657(a)); tear-out, shear and bending take the fitting factor.`;
}

export const ASSUMPTIONS: readonly string[] = [
  "Loads are limit loads from the design pilot force at the grip or pedal (14 CFR 23.397(b), the maximum column for a design weight up to 5,000 lb — a heavier airplane takes more; a wheel's unsymmetrical 100 lb at one handgrip is not applied, nor is the single tangential force of 1.25 × a wheel's roll-couple force on the critical parts of the aileron system, a footnote to that table as recalled here — check those to the designer's figures); where a surface's hinge moment is given, 125 % of it sets them instead, between the minimum and maximum pilot forces (14 CFR 23.395). With several surfaces the largest case is applied to the whole run.",
  "Crank arms are taken perpendicular to their links (F_out = F_in · L_in / L_out); a horn's effective arm is its length × sin(link angle).",
  "A bellcrank pivot carries the vector sum of its two arm loads at the arm angle; idler arms, torque tubes, sticks and pedals are taken with their arms opposite, the largest resultant.",
  "Where a port carries several joints, each is taken to carry the full force; every pivot and hinge joint of a part carries the whole pivot or hinge load.",
  "A hinge joint carries the designer's limit hinge load entered on its card (the surface's own air load, which only the designer's figures give) plus the control system's load there, added as if in line (conservative); without the designer's figure the hinge is not checked.",
  FACTOR_LINE,
  "A stop reacts the moment of the part it stops over its arm from that part's pivot; a horn's bolts share the link force and carry the hinge moment's couple, added in line (conservative).",
  "Bolt bending: single shear M = P × (spacers + half the ball or member width); double shear with spacers M = P/2 × (gap + cheek/2 + ball/4); allowable Ftu × 1.5 × πD³/32.",
  "Pushrods are pinned-pinned columns (K = 1), Euler or Johnson; the design force pushes and pulls, so each pushrod is checked both ways at the same load. Tension is checked on the tube's whole section: the end fittings (the insert and its rivets or weld) and any holes through the tube are not checked here — check them to the designer's drawing.",
  "With dual controls each pilot's force is 75 % and the inputs' loads are added (both pilots pushing the same way); the single-pilot full-force case is checked too and the larger load kept. Otherwise the largest single input governs.",
  "Cables carry tension only. Two cables between the same two parts are a closed circuit; the pulling cable carries the larger of the force and the circuit's rigging tension plus half the force (legs of equal stiffness), its slack partner less; without a recorded rigging tension the force alone is used and the strength is not checked. With dual controls the two pilots' cable tensions are added, each with the rigging tension — conservative.",
  "A pulley or fairlead carries 2·T·sin(θ/2) for a cable of tension T turned through θ; cable-system joints and cables take the cable-system special factor (14 CFR 23.693) when it is the highest.",
  "The drawing is planar and has no airframe coordinates: rod-end misalignment and the four-bar transmission angle are not measured from it.",
];

/** With geometry, these replace the perpendicular-arm and no-geometry lines for the runs that were swept. */
export const MOTION_ASSUMPTIONS: readonly string[] = [
  "Runs with geometry are swept through the input's travel in small steps on the branch they are assembled in; each pushrod, rod end, pivot and hinge load is its largest over the travel the run has (to its stops), with the input position where it occurs.",
  "The design force acts at the grip or pedal square to its arm; each rod's load is the torque over its effective arm (arm × sine of the angle between rod and arm), along the rod's own axis when it leaves the plane.",
  "Motion is planar: every pivot bolt is square to the plane, so a rod end's misalignment is the rod's angle out of the plane and does not change over the travel.",
  "Control sense is read from the sweep for a pitch run from a stick or wheel only, with the forward and up directions set in the geometry (stick forward: a tail's trailing edge down, a canard's up; a tail where the geometry does not say). It is no substitute for moving the controls on the aircraft, which the checklist asks for on every run.",
];

/** Every run swept: the perpendicular-arm and no-geometry lines give way to the motion ones; some swept: both. */
function assumptionsFor(m: MotionReport, settings: AnalysisSettings): string[] {
  const lines = !m.checked ? [...ASSUMPTIONS]
    : !m.notChecked.some((s) => s.startsWith("Motion of the run")) ? [...ASSUMPTIONS.slice(0, 1), ...ASSUMPTIONS.slice(2, -1), ...MOTION_ASSUMPTIONS]
    : [...ASSUMPTIONS.slice(0, -1), ...MOTION_ASSUMPTIONS];
  const factors = factorAssumption(settings);
  return lines.map((l) => (l === FACTOR_LINE ? factors : l));
}

function resolveSettings(settings: Partial<AnalysisSettings> | undefined, out: Finding[]): AnalysisSettings {
  if (!settings) return DEFAULT_SETTINGS;
  const r = settingsSchema.safeParse(settings);
  if (r.success) return r.data;
  out.push(finding("settings-invalid", "caution", linkageSubject("settings"),
    `The build's analysis settings are not valid (${r.error.issues.map((i) => `${i.path.join(".") || "settings"}: ${i.message}`).join("; ")}); the published defaults are used instead.`,
    { kind: "commonPractice", text: "engine: invalid settings fall back to the defaults" }));
  return DEFAULT_SETTINGS;
}

export function analyze(graph: LinkageGraph, settings?: Partial<AnalysisSettings>): Report {
  const findings: Finding[] = [];
  const s = resolveSettings(settings, findings);
  const ctx = buildContext(graph);
  const cc = cableContext(ctx);
  const loads = propagate(ctx, s, cc.pretension);
  // 14 CFR 23.399: the dual-control case never replaces the single-pilot full-force case.
  if (s.dualControls) maxLoads(loads, propagate(ctx, { ...s, dualControls: false }, cc.pretension));
  const motion = analyzeMotion(ctx, s);
  // 14 CFR 23.399 for the swept runs too: each member keeps the larger of the dual-control case (75 % each, added)
  // and one pilot at full force, as the perpendicular-arm loads just did.
  if (s.dualControls && ctx.graph.geometry) {
    const single = analyzeMotion(ctx, { ...s, dualControls: false });
    for (const k of ["pushrod", "joint", "surface"] as const) {
      const into = motion.loads[k];
      for (const [n, v] of single.loads[k]) if (!(v <= (into.get(n) ?? -Infinity))) into.set(n, v);
    }
    // The worst-loads table shows the load each member is checked at: the single pilot's where it is larger.
    const key = (w: WorstLoad) => `${w.subject.type}:${w.subject.id}|${w.what}|${w.inputId}`;
    const solo = new Map(single.report.worstLoads.map((w) => [key(w), w]));
    motion.report.worstLoads = motion.report.worstLoads.map((w) => {
      const o = solo.get(key(w));
      return o && o.limit > w.limit ? o : w;
    });
  }
  // With geometry the swept runs' worst-step loads replace the perpendicular-arm loads of their members.
  for (const [n, v] of motion.loads.pushrod) loads.pushrodAxial[n] = v;
  for (const [j, v] of motion.loads.joint) loads.jointRadial[j] = v;
  for (const [n, v] of motion.loads.surface) loads.surfaceMoment[n] = v;
  findings.push(...motion.findings);

  // The to-do of a load carried through a part's starting values, made once per such part (not once per joint).
  const loadTodos = new Map<number, string>();
  const loadTodoFrom = (from: number): string | null => {
    if (!from) return null;
    let t = loadTodos.get(from);
    if (t === undefined) loadTodos.set(from, (t = enterTodo(ctx.nodes[from - 1], unenteredLoadKeys(ctx.nodes[from - 1]))));
    return t;
  };
  const pushrods: PushrodResult[] = [];
  const surfaces: SurfaceResult[] = [];
  const pushrodNodes: number[] = [];
  for (let n = 0; n < ctx.nodes.length; n++) {
    const node = ctx.nodes[n];
    if (node.kind === "pushrod") {
      pushrods.push(pushrodResult(node, loads.pushrodAxial[n], loads.driven[n] === 1, s, loadTodoFrom(loads.nodeFrom[n])));
      pushrodNodes.push(n);
    } else if (ctx.nodeRole[n] === "surface") {
      surfaces.push({ nodeId: node.id, hingeMomentLimit: loads.surfaceMoment[n], driven: loads.driven[n] === 1, designHingeMoment: null, loadCase: null });
    }
  }
  const designCase = hingeMomentCase(ctx, loads, surfaces, s, s.dualControls, findings);
  if (designCase.scale !== 1) for (const p of pushrods) rescale(p, designCase.scale);
  const path = pathLoads(ctx, loads, findings);
  const joints: JointResult[] = new Array(ctx.joints.length);
  for (let j = 0; j < ctx.joints.length; j++) {
    // A load carried through a part's starting values is not the builder's: the joint's checks say what to enter.
    // A joint no input reaches carries no known load (zero is not a load): its checks are not made.
    const a = ctx.jFrom[j], b = ctx.jTo[j];
    const driven = (a >= 0 && loads.driven[a] === 1) || (b >= 0 && loads.driven[b] === 1);
    joints[j] = jointResult(ctx, j, loads, s, path.loadTodo[j] ?? loadTodoFrom(loads.jointFrom[j]) ?? (driven ? null : UNDRIVEN_TODO), cc.cableJoint[j] === 1 ? CABLE_JOINT : OTHER_JOINT);
  }
  const cables = cableResults(ctx, cc, loads, s);
  const cautions = settingsCautions(s, findings);

  structureFindings(ctx, loads, findings, cc);
  strengthFindings(ctx, pushrodNodes, pushrods, s, findings);
  jointFindings(ctx, joints, s, findings);
  retentionFindings(ctx, findings);
  unenteredFindings(ctx, findings);
  cableFindings(ctx, cc, loads, cables, s, findings);
  secondaryInputFindings(ctx, s, findings);

  const sorted = sortFindings(findings);
  return {
    engineVersion: ENGINE_VERSION,
    findings: sorted,
    pushrods,
    joints,
    summary: summarize(sorted, pushrods, joints, cables),
    settings: s,
    surfaces,
    cables,
    assumptions: assumptionsFor(motion.report, s),
    motion: motion.report,
    notice: NOTICE,
    designCase,
    settingsCautions: cautions,
  };
}

// The two factor options a joint can have, made once rather than once per joint.
const CABLE_JOINT: FactorOptions = { cable: true }, OTHER_JOINT: FactorOptions = {};

/** Scale a pushrod's loads (the hinge-moment case) and recompute its margins. */
function rescale(p: PushrodResult, k: number) {
  p.limitAxial *= k;
  p.ultimateAxial *= k;
  if (p.todo) return; // not checked: no margins to recompute
  p.marginCompression = marginOfSafety(p.columnAllowable, p.ultimateAxial);
  p.marginTension = marginOfSafety(p.tensionAllowable, p.ultimateAxial);
}
