/**
 * Every way a joint can fail (domain.md §3), each a check that is either computed (required, allowable,
 * margin) or "not checked" with what to enter — never a margin made up from a default:
 * rod-end rating, bolt or clevis-pin shear, bolt bending, bearing and tear-out at the hole in each member,
 * ball or roller bearing rating, and the rod end's thread in tension. Required loads are limit × ultimate
 * factor × the fitting factor (14 CFR 23.625); bearing at a hole takes the joint's special factor instead
 * when a higher one applies (shared/analysis/joints/factors.ts, 14 CFR 23.619).
 */
import { boltlessContact } from "../../linkage/contacts";
import { ALUMINIUM_BOLT_FSU, STEEL_BOLT_FSU, STEEL_BOLT_FTU, boltShearStrength } from "../../hardware/bolts";
import {
  ALUMINIUM_BOLT_FTU, BEARING_SRC, BENDING_SRC, BUSHING_TABLE, MIN_EDGE_RATIO, PLATE_TABLE, ROD_END_BODY_FTU,
  ROD_END_BODY_SRC, ROUND_SHAPE_FACTOR, TEAR_OUT_SRC, bearingUltimate, tearOutStrength, type PlateRow,
} from "../../hardware/plates";
import { SRC } from "../../hardware/sources";
import { THREADS_BY_NAME, type ThreadName } from "../../hardware/threads";
import { TUBE_MATERIALS_BY_NAME, type TubeMaterial } from "../../hardware/materials";
import { enterTodo, MATERIAL_KEY, unenteredOf } from "../unentered";
import { boltMaterialOf } from "../../hardware/bolts";
import type { JointHardware, Member } from "../../linkage/schema";
import type { AnalysisSettings, CheckId, JointCheck, JointRole, SourceTag, SpecialFactor } from "../types";
import { type Ctx, nodeLabel } from "../context";
import { partName } from "../../linkage/names";
import { marginOfSafety } from "../allowables";

// Module-level aliases: read imports once, not through re-export getters on every joint.
const margin = marginOfSafety, labelOf = nodeLabel, PLATES = PLATE_TABLE, BUSHINGS = BUSHING_TABLE, THREADS = THREADS_BY_NAME, TUBES = TUBE_MATERIALS_BY_NAME;
const BODY_FTU = ROD_END_BODY_FTU, FBRU = bearingUltimate, TEAR = tearOutStrength, SHEAR = boltShearStrength;
const MIN_ED = MIN_EDGE_RATIO, SHAPE = ROUND_SHAPE_FACTOR, FSU_STEEL = STEEL_BOLT_FSU, FSU_ALU = ALUMINIUM_BOLT_FSU, FTU_STEEL = STEEL_BOLT_FTU, FTU_ALU = ALUMINIUM_BOLT_FTU;

const RATING_SRC: SourceTag = SRC.rodEndRating;
const BALL_SRC: SourceTag = { kind: "published", text: "14 CFR 23.693, 23.657(a): a ball or roller bearing's rating may not be exceeded" };
const PIN_SRC: SourceTag = { kind: "published", text: "14 CFR 23.689(d); pin shear Fsu · πD²/4 per plane" };
const THREAD_SRC: SourceTag = SRC.threads;

export type CheckInput = {
  ctx: Ctx;
  j: number;
  role: JointRole;
  /** Limit radial load, lbf; null when the load itself is not known (see loadTodo). */
  limit: number | null;
  /** What to enter before the joint's load is known (a stop's arm, a horn's bolts). */
  loadTodo: string | null;
  settings: AnalysisSettings;
  special: SpecialFactor;
};

type Side = "from" | "to";

/** Fastener diameter at the joint: the clevis pin's, else the bolt's. */
export function fastenerDiameter(hw: JointHardware, boltDia: (b: NonNullable<JointHardware["bolt"]>) => number | null): number | null {
  if (hw.clevisPin) return hw.clevisPin.diameter;
  return hw.bolt ? boltDia(hw.bolt) : null;
}

// The four possible answers of holeSides, shared: a fresh array per joint was garbage on every call.
const BOTH_SIDES: readonly Side[] = ["from", "to"], FROM_SIDE: readonly Side[] = ["from"], TO_SIDE: readonly Side[] = ["to"], NO_SIDE: readonly Side[] = [];

/** Which sides of the joint are members with a bolt hole (not the rod end's eye, not a ball bearing's housing). */
function holeSides(c: CheckInput, hw: JointHardware): readonly Side[] {
  // Stops too: a stop bolt takes the system's load at its contact (14 CFR 23.675), in the holes it passes through.
  if (!(hw.bolt || hw.clevisPin)) return NO_SIDE;
  const from = hasHole(c, hw, "from"), to = hasHole(c, hw, "to");
  return from ? (to ? BOTH_SIDES : FROM_SIDE) : to ? TO_SIDE : NO_SIDE;
}

/** A joint where nothing is bolted: a cable over a pulley or through a fairlead, a terminal screwed into a turnbuckle (shared/linkage/contacts.ts). */
function cableContact({ ctx, j }: CheckInput): boolean {
  const f = ctx.jFrom[j], t = ctx.jTo[j];
  if (f < 0 || t < 0) return false;
  const joint = ctx.joints[j];
  return boltlessContact({ kind: ctx.nodes[f].kind, port: joint.from.port }, { kind: ctx.nodes[t].kind, port: joint.to.port }) !== null;
}

function hasHole({ ctx, j }: CheckInput, hw: JointHardware, side: Side): boolean {
  const n = side === "from" ? ctx.jFrom[j] : ctx.jTo[j];
  if (n < 0) return false;
  const port = ctx.joints[j][side].port;
  if (hw.rodEnd && ctx.nodeRole[n] === "link") return false; // the rod end's eye: its rating covers it
  if (hw.bearing === "ballBearing" && (port === "pivot" || port === "hinge")) return false; // the bearing's housing: its rating
  return true;
}

function missing(m: Member | undefined, needs: ("material" | "thickness" | "edgeDistance")[]): string[] {
  const words = { material: "material", thickness: "thickness", edgeDistance: "edge distance" } as const;
  return needs.filter((k) => m?.[k] === undefined).map((k) => words[k]);
}

const NONE: string[] = [];
const HOLE_NEEDS: ("material" | "thickness" | "edgeDistance")[] = ["material", "thickness", "edgeDistance"];
const TEAR_BASIS = Object.fromEntries(Object.values(PLATE_TABLE).map((p) => [p.name, `2 · t · (e − D/2) · Fsu ${p.fsu / 1000} ksi (${p.name})`])) as Record<string, string>;
const LABEL = { rodEndRating: "rod-end rating", bearingRating: "ball or roller bearing rating" } as const;

/**
 * Texts that repeat from joint to joint, made once per analysis: the hole labels of a part's name, a
 * material's bearing basis at one e/D, a thread check's label and basis. Every check keeps its label and
 * basis in the report; built afresh they were several new strings a joint, all kept, and a 10,000-part
 * report no longer fit V8's young generation (README, "Measured"). Each text depends only on its keys, so
 * a shared one is the same text. Kept per analysis (keyed by its Ctx, dropped with it): a server that
 * checks many linkages keeps none of them.
 */
type Texts = {
  /** By part name (parts without a label share their kind's name): [bearing label, tear-out label]. */
  holeLabels: Map<string, readonly [string, string]>;
  bearingBasis: Map<PlateRow, Map<number, string>>;
  threadLabel: Map<string, string>;
  /** thread → what the thread is cut in (a rod end's body material, or the pushrod's tube material) → basis. */
  threadBasis: Map<ThreadName, Map<string | TubeMaterial | null, string>>;
};
const textsByCtx = new WeakMap<Ctx, Texts>();

function textsOf(ctx: Ctx): Texts {
  let t = textsByCtx.get(ctx);
  if (!t) {
    t = { holeLabels: new Map(), bearingBasis: new Map(), threadLabel: new Map(), threadBasis: new Map() };
    textsByCtx.set(ctx, t);
  }
  return t;
}

/** Bearing and tear-out labels of the hole in part n (or in the `side` member when the part is missing). */
function holeLabels(ctx: Ctx, t: Texts, n: number, side: Side): readonly [string, string] {
  if (n < 0) return [`bearing at the hole in ${side}`, `tear-out at the hole in ${side}`];
  const node = ctx.nodes[n];
  const key = partName(node); // nodeLabel quotes the part's name: the same name, the same labels
  let labels = t.holeLabels.get(key);
  if (!labels) {
    const name = labelOf(node);
    t.holeLabels.set(key, (labels = [`bearing at the hole in ${name}`, `tear-out at the hole in ${name}`]));
  }
  return labels;
}

function bearingBasis(t: Texts, plate: PlateRow, ed: number): string {
  let byRatio = t.bearingBasis.get(plate);
  if (!byRatio) t.bearingBasis.set(plate, (byRatio = new Map()));
  let text = byRatio.get(ed);
  if (text === undefined) byRatio.set(ed, (text = `${plate.name} Fbru ${Math.round(FBRU(plate, ed) / 1000)} ksi at e/D ${Math.round(ed * 100) / 100} × D × t`));
  return text;
}

function threadLabel(t: Texts, thread: string): string {
  let text = t.threadLabel.get(thread);
  if (text === undefined) t.threadLabel.set(thread, (text = `${thread} thread in tension`));
  return text;
}

/** `body`: the rod end's body material (male shank), the pushrod's tube material (female), or null when unknown. */
function threadBasis(t: Texts, thread: ThreadName, body: string | TubeMaterial | null): string {
  let byBody = t.threadBasis.get(thread);
  if (!byBody) t.threadBasis.set(thread, (byBody = new Map()));
  let text = byBody.get(body);
  if (text === undefined) {
    const th = THREADS[thread];
    const ftu = body === null ? null : typeof body === "string" ? BODY_FTU[body as keyof typeof BODY_FTU] : body.ftu;
    const what = body === null ? "" : typeof body === "string" ? `rod-end body (${body})` : `pushrod end (${body.name})`;
    text = `A_t ${th ? th.tensileStressArea : "?"} in² × Ftu ${ftu === null ? "?" : Math.round(ftu / 1000)} ksi of the ${what || "threaded part"}`;
    byBody.set(body, text);
  }
  return text;
}

const scratch: JointCheck[] = [];

type Acc = { checks: JointCheck[]; count: number; base: number | null; loadTodo: string | null };

function addCheck(a: Acc, id: CheckId, label: string, factor: number, allowable: number | null, todo: string | null, basis: string, source: SourceTag, unit: "lbf" | "in·lbf" = "lbf", arm: number | null = 1) {
  const required = a.base === null || arm === null ? null : a.base * factor * arm;
  const computed = required !== null && allowable !== null && !todo && !a.loadTodo;
  const t = computed ? null : a.loadTodo && todo ? `${a.loadTodo}; ${todo}` : a.loadTodo || todo;
  a.checks[a.count++] = {
    id, label, status: computed ? "computed" : "notChecked", required, allowable, unit,
    margin: computed ? margin(allowable!, required!) : null, factor, todo: t, basis, source,
  };
}

const BOLT_MATERIAL_TODO = "enter the bolt's material (steel or aluminium)";
/** The to-do of a bolt with no shank diameter (a custom bolt): joints/findings.ts words it as its own finding. */
export const BOLT_DIAMETER_TODO = "enter the bolt's shank diameter";
/** The to-do of a joint that must turn on or be held by a fastener and has none recorded (joints/findings.ts). */
export const NO_FASTENER_TODO = "record the bolt or clevis pin that holds this joint";

export function jointChecks(c: CheckInput, boltDia: (b: NonNullable<JointHardware["bolt"]>) => number | null): JointCheck[] {
  const { ctx, j, settings, special } = c;
  const hw = ctx.joints[j].hardware;
  if (!hw) return [];
  // Gathered in one list reused for every joint (acc.count of it filled), then copied out at its exact
  // length: a list grown by push keeps room for 17 checks (a joint has at most ten) in every joint of the report.
  const checks = scratch;
  const ff = settings.fittingFactor; // 14 CFR 23.625
  const base = c.limit === null ? null : c.limit * settings.ultimateFactor; // 14 CFR 23.303
  const acc: Acc = { checks, count: 0, base, loadTodo: c.loadTodo };
  // Rod-end rating (rated ultimate radial static load).
  const re = hw.rodEnd;
  if (re) {
    // With the setting that treats rod ends as plain bearings, the bearing factor (14 CFR 23.693), and at a hinge the
    // hinge factor the joint already carries (6.67, 14 CFR 23.657(a): a hinge that is not a ball or roller bearing).
    const f = settings.bearingFactorOnRodEnds ? Math.max(ff, settings.bearingFactor, c.role === "hinge" ? special.value : 0) : ff;
    addCheck(acc, "rodEndRating", LABEL.rodEndRating, f, re.ratedUltimate ?? null, re.ratedUltimate === undefined ? "enter the rod end's rated ultimate radial load from its maker" : null, "the maker's rated ultimate radial load", RATING_SRC);
  }

  // Fastener shear: the clevis pin, else the bolt.
  // Unentered, the shear planes are not assumed (two would double the allowable): the check reads "not checked".
  const planes = hw.shear === "single" ? 1 : hw.shear === "double" ? 2 : null;
  const SHEAR_TODO = "choose single or double shear on the joint's card";
  const pin = hw.clevisPin;
  const isPin = !!pin || (hw.bearing === "clevisPin" && !hw.bolt);
  const d = fastenerDiameter(hw, boltDia);
  if (isPin) {
    const todo = !pin ? "enter the clevis pin's diameter and shear strength" : pin.shearStrength === undefined ? "enter the clevis pin's shear strength (Fsu) from its maker" : planes === null ? SHEAR_TODO : null;
    const allow = pin?.shearStrength !== undefined && planes !== null ? SHEAR(pin.diameter, pin.shearStrength, planes) : null;
    addCheck(acc, "pinShear", shearLabel("clevis pin shear", planes), ff, allow, todo, pin ? `Fsu ${pin.shearStrength === undefined ? "?" : Math.round(pin.shearStrength / 1000)} ksi × πD²/4 × ${planes ?? "?"}` : "no pin recorded", PIN_SRC);
  } else if (hw.bolt) {
    const mat = boltMaterialOf(hw.bolt);
    const alu = mat === "aluminium";
    const allow = d === null || planes === null || mat === null ? null : SHEAR(d, alu ? FSU_ALU : FSU_STEEL, planes);
    addCheck(acc, "boltShear", shearLabel("bolt shear", planes), ff, allow, d === null ? BOLT_DIAMETER_TODO : mat === null ? BOLT_MATERIAL_TODO : planes === null ? SHEAR_TODO : null,
      mat === null ? `Fsu of the bolt's material × πD²/4 × ${planes ?? "?"}`
        : `${alu ? "aluminium" : "steel"} ${Math.round((alu ? FSU_ALU : FSU_STEEL) / 1000)} ksi${hw.bolt.material === undefined ? " (an AN bolt, taken as steel: material not recorded)" : ""} × πD²/4 × ${planes ?? "?"}`,
      alu ? SRC.aluminiumBolts : SRC.anBolts);
  } else if (re || ((c.role === "link" || c.role === "pivot" || c.role === "hinge") && !cableContact(c))) {
    // A rod end, or parts that turn on each other, with no bolt or pin recorded: the fastener's checks are listed
    // as not made (joints/findings.ts words it as its own finding), never left out as if there were none to make.
    addCheck(acc, "boltShear", "bolt or pin shear", ff, null, NO_FASTENER_TODO, "no bolt or pin recorded", SRC.anBolts);
  }

  const sides = holeSides(c, hw);
  const mFrom = hw.holes?.from, mTo = hw.holes?.to;

  // Bolt bending: single shear, or double shear with spacers (gaps) in the stack.
  const gaps = hw.spacers;
  // Only a recorded shear case picks a formula: unrecorded, single shear's bending (the larger) is not assumed away.
  if ((hw.bolt || pin) && (hw.shear === "single" || (hw.shear === "double" && gaps !== undefined && gaps > 0))) {
    const members = sides.map((sd) => (sd === "from" ? mFrom : mTo));
    const ftu = pin ? (pin.shearStrength !== undefined ? pin.shearStrength / 0.6 : null) // Fsu ≈ 0.6 Ftu, from memory
      : boltMaterialOf(hw.bolt!) === null ? null : boltMaterialOf(hw.bolt!) === "aluminium" ? FTU_ALU : FTU_STEEL;
    const need: string[] = [];
    if (d === null) need.push("the shank diameter");
    if (!pin && ftu === null) need.push("the bolt's material");
    if (pin && ftu === null) need.push("the pin's shear strength");
    if (gaps === undefined) need.push("the washers and spacers between the member's face and the ball (0 if none)");
    let arm: number | null = null;
    let how = "";
    const innerWidth = re ? re.ballWidth : null;
    if (hw.shear === "single") {
      // M = P · a, a = spacers + half the width of the loaded part (domain.md §3).
      const w = innerWidth ?? (re ? null : maxThickness(members));
      if (w === null || w === undefined) need.push(re ? "the rod end's ball width" : "the thickness of both members");
      else if (gaps !== undefined) { arm = gaps + w / 2; how = `M = P × (${fmt3(gaps)} + ${fmt3(w)}/2) in`; }
    } else {
      // Double shear with gaps: M = (P/2)·(g + t_cheek/2 + w/4) [from memory: pin bending in a clevis].
      let fork: Member | undefined, otherM: Member | undefined;
      for (const m of members) if (m?.cheeks === 2 && !fork) fork = m;
      if (!fork && re && members.length === 1) fork = members[0];
      for (const m of members) if (m && m !== fork && !otherM) otherM = m;
      const other = re ? innerWidth : otherM?.thickness;
      if (!fork?.thickness) need.push(re ? "the fork's thickness (both cheeks)" : "which member is the fork (2 cheeks) and its thickness");
      if (other === undefined || other === null) need.push(re ? "the rod end's ball width" : "the middle member's thickness");
      if (fork?.thickness && other && gaps !== undefined) {
        const tc = fork.thickness / (fork.cheeks ?? 2);
        arm = (gaps + tc / 2 + other / 4) / 2;
        how = `M = P/2 × (${fmt3(gaps)} + ${fmt3(tc)}/2 + ${fmt3(other)}/4) in`;
      }
    }
    const allow = d !== null && ftu !== null ? ftu * SHAPE * (Math.PI * d * d * d) / 32 : null;
    addCheck(acc, "boltBending", `${pin ? "pin" : "bolt"} bending, ${hw.shear} shear`, ff, allow, need.length ? `enter ${need.join(", ")}` : null,
      `${how ? how + "; " : ""}allowable Ftu ${ftu === null ? "?" : Math.round(ftu / 1000)} ksi × shape factor ${SHAPE} × πD³/32`, BENDING_SRC, "in·lbf", arm);
  }

  else if ((hw.bolt || pin) && (hw.shear === undefined || gaps === undefined)) {
    // Whether the bolt bends is not known: a single-shear joint does, a double-shear one with gaps in the stack does.
    // Listed as not checked with what decides it, never left out as if there were nothing to check.
    addCheck(acc, "boltBending", `${pin ? "pin" : "bolt"} bending`, ff, null,
      hw.shear === undefined ? "choose single or double shear on the joint's card" : "enter the washers and spacers between the member's face and the ball (0 if none)",
      "M = P × arm, by the shear planes and the gaps in the stack", BENDING_SRC, "in·lbf", null);
  }

  // Bearing and tear-out at the hole in each member.
  const texts = textsOf(ctx);
  for (let i = 0; i < sides.length; i++) {
    const s = sides[i], m = s === "from" ? mFrom : mTo;
    const n = s === "from" ? ctx.jFrom[j] : ctx.jTo[j];
    const need = m && m.material !== undefined && m.thickness !== undefined && m.edgeDistance !== undefined ? NONE : missing(m, HOLE_NEEDS);
    const todo = need.length ? `enter the ${need.join(", ")} of ${n >= 0 ? labelOf(ctx.nodes[n]) : s}'s member at the hole` : d === null ? BOLT_DIAMETER_TODO : null;
    let bearAllow: number | null = null, tearAllow: number | null = null, basis = "", short: string | null = null;
    if (!todo && m && d !== null) {
      const plate = PLATES[m.material!];
      const ed = m.edgeDistance! / d;
      if (ed < MIN_ED - 1e-9) short = `edge distance ${fmt3(m.edgeDistance!)} in is ${ed.toFixed(2)} × D, under the ${MIN_ED} × D the bearing allowables start at: move the hole or use a wider member`;
      const plateAllow = FBRU(plate, ed) * d * m.thickness!;
      bearAllow = plateAllow;
      basis = bearingBasis(texts, plate, ed);
      if (m.bushing) {
        const b = BUSHINGS[m.bushing];
        const bushAllow = b.fbru20 * d * m.thickness!;
        if (bushAllow < plateAllow) { bearAllow = bushAllow; basis = `${b.name} Fbru ${Math.round(b.fbru20 / 1000)} ksi × D × t (softer than the ${plate.name} member)`; }
      }
      tearAllow = TEAR(m.thickness!, m.edgeDistance!, d, plate.fsu);
    }
    const labels = holeLabels(ctx, texts, n, s); // [bearing, tear-out]; indexed, as destructuring allocates an iterator
    addCheck(acc, s === "from" ? "bearingFrom" : "bearingTo", labels[0], Math.max(ff, special.value), bearAllow, todo ?? short, basis || "Fbru · D · t", BEARING_SRC);
    addCheck(acc, s === "from" ? "tearOutFrom" : "tearOutTo", labels[1], ff, tearAllow, todo, m?.material ? TEAR_BASIS[m.material] : "2 · t · (e − D/2) · Fsu", TEAR_OUT_SRC);
  }

  // Ball or roller bearing: its rating may not be exceeded.
  if (hw.bearing === "ballBearing") {
    addCheck(acc, "bearingRating", LABEL.bearingRating, ff, hw.bearingRating ?? null, hw.bearingRating === undefined ? "enter the bearing's rated radial load from its maker" : null, "the maker's rated radial load", BALL_SRC);
  }

  // Rod-end shank (or the pushrod's threaded end, for a female rod end) in tension at its stress area.
  if (re && c.role === "link") {
    const th = THREADS[re.thread];
    // `body`: what the thread is cut in, which with the thread sets the basis text (threadBasis).
    let ftu: number | null = null, body: string | TubeMaterial | null = null, todo: string | null = null, source = ROD_END_BODY_SRC;
    if (re.shank === "male") {
      if (re.bodyMaterial) { ftu = BODY_FTU[re.bodyMaterial]; body = re.bodyMaterial; }
      else todo = "enter the rod end's body material";
    } else {
      const n = ctx.jFrom[j] >= 0 && ctx.nodeRole[ctx.jFrom[j]] === "link" ? ctx.jFrom[j] : ctx.jTo[j];
      const pn = n >= 0 ? ctx.nodes[n] : null;
      const starting = pn ? unenteredOf(pn, MATERIAL_KEY).length > 0 : false;
      const mat = pn && pn.kind === "pushrod" && !starting ? TUBES[pn.props.material] : undefined;
      if (mat) { ftu = mat.ftu; body = mat; source = mat.source; }
      else todo = starting ? enterTodo(pn!, MATERIAL_KEY) : "enter the pushrod's material";
    }
    const allow = th && ftu !== null ? th.tensileStressArea * ftu : null;
    addCheck(acc, "threadTension", threadLabel(texts, re.thread), ff, allow, todo, threadBasis(texts, re.thread, body), todo ? THREAD_SRC : source);
  }
  return checks.slice(0, acc.count);
}

function maxThickness(ms: (Member | undefined)[]): number | null {
  let t = 0;
  if (ms.length < 2) return null;
  for (const m of ms) {
    if (m?.thickness === undefined) return null;
    t = Math.max(t, m.thickness);
  }
  return t;
}

function fmt3(v: number): string {
  return String(Number(v.toFixed(3)));
}

/** "bolt shear, single shear", "…, double shear", or "…, shear planes not entered". */
function shearLabel(what: string, planes: 1 | 2 | null) {
  return `${what}, ${planes === 1 ? "single shear" : planes === 2 ? "double shear" : "shear planes not entered"}`;
}
