/**
 * Rigging range of a pushrod: how far its centre-to-centre length can be adjusted with the rod ends it has.
 * Each rod end screws out until only the minimum engagement is left (a rule of thumb standing in for the witness hole: at least 1×D
 * in steel, 2×D in aluminium, D = the thread's major diameter [common practice]) and in until its whole
 * thread is engaged. From the length on the card (as assembled, with each end's recorded engaged length):
 *   shortest = card − Σ (thread length − engaged),   longest = card + Σ (engaged − minimum engagement).
 * Jam-nut thickness is not taken off the thread length (it is not in the format): the short end of the range is
 * optimistic by one jam nut per end, which the message says.
 */
import type { LinkageNode } from "../../linkage/schema";
import { THREADS_BY_NAME, TUBE_MATERIALS_BY_NAME } from "../../hardware";
import { MATERIAL_KEY, unenteredOf } from "../unentered";
import { type Ctx, jointLabel } from "../context";

export type Rigging =
  | { ok: true; shortest: number; longest: number; card: number; minEngagement: number[] }
  | { ok: false; toEnter: string[] };

/** Minimum thread engagement, in: 1×D in steel, 2×D in aluminium [common practice]. */
export function minEngagement(threadMajor: number, family: "steel" | "aluminium"): number {
  return (family === "aluminium" ? 2 : 1) * threadMajor; // common practice, no source (domain.md §4 rule 2)
}

export function riggingRange(ctx: Ctx, rod: number, joints: [number, number]): Rigging {
  const node = ctx.nodes[rod] as Extract<LinkageNode, { kind: "pushrod" }>;
  // A starting-value material is no material: the longer (aluminium) rule, as the retention check does.
  const family = unenteredOf(node, MATERIAL_KEY).length ? "aluminium" : TUBE_MATERIALS_BY_NAME[node.props.material]?.family ?? "aluminium";
  const toEnter: string[] = [];
  let minus = 0, plus = 0;
  const mins: number[] = [];
  for (const j of joints) {
    const hw = ctx.joints[j].hardware;
    const re = hw?.rodEnd;
    const lack: string[] = [];
    if (!re) lack.push("rod end");
    if (re && re.threadLength === undefined) lack.push("thread length");
    if (hw?.engagement?.engagedLength === undefined) lack.push("engaged length");
    if (lack.length || !re) { toEnter.push(`${jointLabel(ctx, j)}: ${lack.join(", ")}`); continue; }
    const e = hw.engagement!.engagedLength!;
    const t = re.threadLength!;
    const m = minEngagement(THREADS_BY_NAME[re.thread].majorDiameter, family);
    mins.push(m);
    minus += Math.max(0, t - e);
    plus += e - m;
  }
  if (toEnter.length) return { ok: false, toEnter };
  const card = node.props.length;
  return { ok: true, shortest: card - minus, longest: card + plus, card, minEngagement: mins };
}
