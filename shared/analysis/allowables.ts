/**
 * Allowables and margins (domain.md §3): pushrod column (Euler / Johnson, pinned-pinned K = 1) and tension,
 * bolt diameter, the joint's special factor (joints/ has every joint check). MS = allowable / required − 1.
 * The column and section formulas are unit-agnostic (tests run them in SI); the engine calls them in in, lbf, psi.
 */
import type { LinkageNode } from "../linkage/schema";
import { AN_BOLTS_BY_SIZE, SRC, TUBE_MATERIALS_BY_NAME, type AnBoltSize } from "../hardware";
import type { JointHardware } from "../linkage/schema";
import type { AnalysisSettings, Finding, JointResult, PushrodResult } from "./types";
import { type Ctx, nodeLabel } from "./context";
import { selectSpecialFactor } from "./joints/factors";
import { finding, fmt, fmtMargin, nodeSubject, num } from "./format";

const WALL_KEYS = ["wall", "outsideDiameter"] as const;
import { enterTodo, TUBE_KEYS, unenteredOf } from "./unentered";

/** Margins are capped so a report stays finite and JSON-safe (an unloaded part has "infinite" margin). */
export const MARGIN_CAP = 999;

export function marginOfSafety(allowable: number, required: number): number {
  if (!(required > 0)) return MARGIN_CAP;
  const ms = allowable / required - 1;
  return Number.isFinite(ms) ? Math.min(ms, MARGIN_CAP) : MARGIN_CAP;
}

export type TubeSection = { area: number; inertia: number; radiusOfGyration: number; insideDiameter: number; solid: boolean };

/** Round tube: A = π(Do² − Di²)/4, I = π(Do⁴ − Di⁴)/64, r = √(I/A). A wall of half the diameter or more is a solid rod. */
export function tubeSection(outsideDiameter: number, wall: number): TubeSection {
  const solid = !(2 * wall < outsideDiameter);
  const di = solid ? 0 : outsideDiameter - 2 * wall;
  const d2 = outsideDiameter * outsideDiameter, i2 = di * di;
  const area = (Math.PI * (d2 - i2)) / 4;
  const inertia = (Math.PI * (d2 * d2 - i2 * i2)) / 64;
  return { area, inertia, radiusOfGyration: Math.sqrt(inertia / area), insideDiameter: di, solid };
}

/** Euler critical load, P = π²EI/(KL)². */
export function eulerLoad(e: number, inertia: number, effectiveLength: number): number {
  return (Math.PI * Math.PI * e * inertia) / (effectiveLength * effectiveLength);
}

/** Johnson parabola, P = A·Fty·[1 − Fty·(KL/r)²/(4π²E)]. */
export function johnsonLoad(area: number, fty: number, e: number, slenderness: number): number {
  return area * fty * (1 - (fty * slenderness * slenderness) / (4 * Math.PI * Math.PI * e));
}

/** Transition slenderness C_c = √(2π²E/Fty). */
export function transitionSlenderness(e: number, fty: number): number {
  return Math.sqrt((2 * Math.PI * Math.PI * e) / fty);
}

export type ColumnInput = { area: number; inertia: number; length: number; e: number; fty: number; k?: number };
export type ColumnResult = { load: number; mode: "euler" | "johnson"; slenderness: number; transition: number };

/** Column allowable: Euler when KL/r ≥ C_c, else Johnson (domain.md §3). */
export function columnAllowable({ area, inertia, length, e, fty, k = 1 }: ColumnInput): ColumnResult {
  const kl = k * length;
  const slenderness = kl / Math.sqrt(inertia / area);
  const transition = transitionSlenderness(e, fty);
  if (slenderness >= transition) return { load: eulerLoad(e, inertia, kl), mode: "euler", slenderness, transition };
  return { load: johnsonLoad(area, fty, e, slenderness), mode: "johnson", slenderness, transition };
}

/** The to-do of a part or joint no stick, pedal or wheel drives: its load is not known (shown as zero). */
export const UNDRIVEN_TODO = "connect it to the run: no stick, pedal or wheel drives it, so its load is not known";

/**
 * `loadTodo`: what to enter before the load is the builder's (a part upstream still at starting values), or null.
 * The tube's own starting values come first: the allowables are not shown from a tube nobody entered.
 */
export function pushrodResult(node: Extract<LinkageNode, { kind: "pushrod" }>, limitAxial: number, driven: boolean, settings: AnalysisSettings, loadTodo: string | null = null): PushrodResult {
  const p = node.props;
  const tube = unenteredOf(node, TUBE_KEYS);
  // Nothing drives it: a zero load is no load to hold the tube against ("not checked", never a margin).
  const todo = tube.length ? enterTodo(node, tube) : loadTodo ?? (driven ? null : UNDRIVEN_TODO);
  const mat = TUBE_MATERIALS_BY_NAME[p.material] ?? TUBE_MATERIALS_BY_NAME["4130N"];
  const sec = tubeSection(p.outsideDiameter, p.wall);
  const col = columnAllowable({ area: sec.area, inertia: sec.inertia, length: p.length, e: mat.e, fty: mat.fty, k: 1 });
  const tension = mat.ftu * sec.area;
  const ultimate = limitAxial * settings.ultimateFactor;
  return {
    nodeId: node.id,
    limitAxial,
    ultimateAxial: ultimate,
    columnAllowable: col.load,
    columnMode: col.mode,
    tensionAllowable: tension,
    marginCompression: todo ? null : marginOfSafety(col.load, ultimate),
    marginTension: todo ? null : marginOfSafety(tension, ultimate),
    area: sec.area,
    slenderness: col.slenderness,
    driven,
    todo,
  };
}

/** Bolt diameter, in: from the AN size, or the recorded diameter for a custom bolt. */
export function boltDiameter(bolt: NonNullable<JointHardware["bolt"]>): number | null {
  if (bolt.size !== "custom") return AN_BOLTS_BY_SIZE[bolt.size as AnBoltSize]?.diameter ?? bolt.diameter ?? null;
  return bolt.diameter ?? null;
}

/** The one special factor on bearing at a joint (14 CFR 23.619: only the highest applies); see joints/factors.ts. */
export function specialFactor(hw: JointHardware | undefined, settings: AnalysisSettings, role: JointResult["role"] = "other"): number {
  return selectSpecialFactor(hw, role, settings).value;
}

/** Findings of the pushrods' strength (the joints' are in joints/findings.ts). */
export function strengthFindings(ctx: Ctx, pushrodNodes: number[], pushrods: PushrodResult[], settings: AnalysisSettings, out: Finding[]) {
  for (let i = 0; i < pushrods.length; i++) {
    const pr = pushrods[i];
    const n = ctx.nodes[pushrodNodes[i]];
    const name = nodeLabel(n);
    if (n.kind === "pushrod" && !(2 * n.props.wall < n.props.outsideDiameter) && !unenteredOf(n, WALL_KEYS).length) {
      out.push(finding("pushrod-wall-too-thick", "caution", nodeSubject(pr.nodeId),
        `Pushrod ${name}: a wall of ${fmt(n.props.wall, 3)} in on a ${fmt(n.props.outsideDiameter, 3)} in tube leaves no bore. The check treats it as a solid rod; check the entered size.`,
        SRC.engineering, [num("outside diameter", n.props.outsideDiameter, "in"), num("wall", n.props.wall, "in")]));
    }
    if (pr.marginCompression !== null && pr.marginCompression < 0) {
      out.push(finding("pushrod-buckles", "hazard", nodeSubject(pr.nodeId),
        `Pushrod ${name} can buckle: pushed at the design force it must carry ${fmt(pr.ultimateAxial)} lbf ultimate (${fmt(pr.limitAxial)} lbf limit × ${fmt(settings.ultimateFactor, 2)}), but as a pinned-end column (${pr.columnMode === "euler" ? "Euler" : "Johnson"}, KL/r ${fmt(pr.slenderness, 0)}) the tube holds only ${fmt(pr.columnAllowable)} lbf — margin ${fmtMargin(pr.marginCompression)}. Use a larger-diameter tube or a shorter run (add an idler).`,
        SRC.column, [num("required ultimate", pr.ultimateAxial, "lbf"), num("column allowable", pr.columnAllowable, "lbf"), num("margin", pr.marginCompression, "")]));
    }
    if (pr.marginTension !== null && pr.marginTension < 0) {
      out.push(finding("pushrod-tension-weak", "hazard", nodeSubject(pr.nodeId),
        `Pushrod ${name} is too weak in tension: it must carry ${fmt(pr.ultimateAxial)} lbf ultimate but the tube section (${fmt(pr.area, 4)} in² × Ftu) holds ${fmt(pr.tensionAllowable)} lbf — margin ${fmtMargin(pr.marginTension)}.`,
        SRC.tubes, [num("required ultimate", pr.ultimateAxial, "lbf"), num("tension allowable", pr.tensionAllowable, "lbf"), num("margin", pr.marginTension, "")]));
    }
  }
}
