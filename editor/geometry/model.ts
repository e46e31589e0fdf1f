/**
 * What the geometry view draws and edits, worked out from the editor's graph: the parts that turn (with
 * the arms that carry links, and their lengths from the part cards), the pushrods between them, and the
 * sweep of every run that has complete geometry (the same engine numbers the report uses).
 */
import { ENGINE, roleOf } from "@/shared/linkage/kinds";
import type { LinkageGeometry } from "@/shared/linkage/geometry";
import type { LinkageGraph, LinkageNode } from "@/shared/linkage/schema";
import { partName } from "@/shared/linkage/names";

export type Turning = { id: string; name: string; role: "input" | "crank" | "horn"; arms: { port: "attach" | "in" | "out" | "grip"; length: number }[] };
export type RodLink = { id: string; name: string; a: { node: string; port: string } | null; b: { node: string; port: string } | null };

const RAD = Math.PI / 180;

export function turningParts(nodes: readonly LinkageNode[]): Turning[] {
  const out: Turning[] = [];
  for (const n of nodes) {
    const role = roleOf(n.kind);
    if (role === "input") {
      const [grip, attach] = (ENGINE[n.kind] as { arms: (p: unknown) => [number, number] }).arms(n.props);
      out.push({ id: n.id, name: partName(n), role, arms: [{ port: "attach", length: attach }, { port: "grip", length: grip }] });
    } else if (role === "crank") {
      const [a, b] = (ENGINE[n.kind] as { arms: (p: unknown) => [number, number] }).arms(n.props);
      out.push({ id: n.id, name: partName(n), role, arms: [{ port: "in", length: a }, { port: "out", length: b }] });
    } else if (role === "horn") {
      out.push({ id: n.id, name: partName(n), role, arms: [{ port: "attach", length: (n.props as { hornArm: number }).hornArm }] });
    }
  }
  return out;
}

export function rodLinks(graph: Pick<LinkageGraph, "nodes" | "joints">): RodLink[] {
  const ends = new Map<string, RodLink>();
  for (const n of graph.nodes) if (roleOf(n.kind) === "link") ends.set(n.id, { id: n.id, name: partName(n), a: null, b: null });
  for (const j of graph.joints) {
    for (const [me, other] of [[j.from, j.to], [j.to, j.from]] as const) {
      const r = ends.get(me.node);
      if (r && (me.port === "a" || me.port === "b") && !ends.has(other.node)) r[me.port] = { node: other.node, port: other.port };
    }
  }
  return [...ends.values()];
}

/** Where an arm's end is, in inches, with the part turned by `rot` degrees from neutral. */
export function armEnd(geo: LinkageGeometry, t: Turning | undefined, port: string, rot = 0): { x: number; y: number } | null {
  if (!t) return null;
  const pg = geo.parts[t.id];
  const angle = pg?.arms[port as "attach"];
  const arm = t.arms.find((a) => a.port === port);
  if (!pg || angle === undefined || !arm) return null;
  const a = (angle + rot) * RAD;
  return { x: pg.pivot.x + arm.length * Math.cos(a), y: pg.pivot.y + arm.length * Math.sin(a) };
}

/** The words for the input's two ways in the view: its forward turn and the other (shared/linkage/geometry.ts). */
export type InputWords = readonly [forward: string, back: string];
export const PITCH_WORDS: InputWords = ["fwd", "back"];
/** Pitch and others: fwd / back; roll: the stick right / left; yaw: the recorded pedal pushed / the other one. */
export function inputWords(system: string, geo: Pick<LinkageGeometry, "yawPedal">): InputWords {
  if (system === "roll") return ["right", "left"];
  if (system === "yaw") return geo.yawPedal ? [`${geo.yawPedal} pedal fwd`, `${geo.yawPedal === "right" ? "left" : "right"} pedal fwd`] : ["pushed", "back"];
  return PITCH_WORDS;
}

/** "5.0° fwd", "3.2° back", "neutral" (or the run's own words: "5.0° right"). */
export function inputWord(theta: number, words: InputWords = PITCH_WORDS): string {
  if (Math.abs(theta) < 0.05) return "neutral";
  return `${Math.abs(theta).toFixed(1)}° ${theta > 0 ? words[0] : words[1]}`;
}
