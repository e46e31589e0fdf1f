/**
 * Values a builder has not entered (shared/linkage/schema.ts, a part's `unentered`): the starting values the
 * editor placed the part with. The check takes nothing from them. A force carried through a part whose arms
 * are starting values is not the builder's force, so every margin downstream of it reads "not checked" and
 * names the part and the values to enter; so does a margin that needs a starting value of its own part
 * (a pushrod's tube, a cable's size). `// common practice, no source`: a margin is shown only where it was
 * computed from the builder's own data.
 */
import type { NodeKind } from "../linkage/kinds";
import type { LinkageNode } from "../linkage/schema";
import { type Ctx, nodeLabel } from "./context";
import { finding, nodeSubject } from "./format";
import type { Finding } from "./types";

/**
 * The props of each kind that the force passes through (arms, the arm angle at a pivot, a horn's link angle,
 * the turn of a cable over a guide, a wheel's axis and diameter, a stick's axis that picks its design force).
 * tests/shared/analysis/unentered.test.ts changes each starting value of each kind in turn and checks that
 * every one that moves a load is listed here.
 */
export const LOAD_KEYS: Partial<Record<NodeKind, readonly string[]>> = {
  stick: ["gripArm", "attachArm", "axis"],
  pedal: ["pedalArm", "attachArm"],
  cablePedal: ["pedalArm", "cableArm"],
  controlWheel: ["axis", "diameter", "columnArm", "attachArm"],
  bellcrank: ["inputArm", "outputArm", "armAngle"],
  idlerArm: ["inputArm", "outputArm"],
  torqueTube: ["inputArm", "outputArm"],
  cableSector: ["inputArm", "sectorRadius"],
  controlHorn: ["hornArm", "linkAngle"],
  pulley: ["wrapAngle"],
};

/** How a message names a value: "grip arm", "outside diameter". Every starting value of every kind has words (tested). */
export const VALUE_WORDS: Record<string, string> = {
  gripArm: "grip arm",
  attachArm: "attach arm",
  axis: "axis",
  travelFwd: "forward travel",
  travelAft: "aft travel",
  travel: "travel",
  pedalArm: "pedal arm",
  cableArm: "cable arm",
  diameter: "diameter",
  columnArm: "column arm",
  inputArm: "input arm",
  outputArm: "output arm",
  armAngle: "angle between the arms",
  sectorRadius: "sector radius",
  hornArm: "horn arm",
  linkAngle: "link angle at neutral",
  travelUp: "up travel",
  travelDown: "down travel",
  wrapAngle: "wrap angle",
  grooveFor: "groove cable size",
  bearing: "bearing",
  material: "material",
  outsideDiameter: "outside diameter",
  wall: "wall thickness",
  length: "length",
  size: "size",
  construction: "construction",
  terminalA: "terminal at A",
  terminalB: "terminal at B",
  stopAt: "contact angle",
  note: "note of where it is fixed",
};

/** The part's unentered values among `keys` (all of them when `keys` is omitted); empty when all are entered. */
const NONE: readonly string[] = Object.freeze([]);

export function unenteredOf(node: LinkageNode, keys?: readonly string[]): readonly string[] {
  const u = node.unentered;
  // Most parts have none: no allocation on the 10,000-part path. (A graph that skipped the schema may hold anything.)
  if (!Array.isArray(u) || u.length === 0) return NONE;
  return keys ? keys.filter((k) => u.includes(k)) : u;
}

/** "grip arm and link arm", "outside diameter, wall thickness and length". */
export function valueWords(keys: readonly string[]): string {
  const w = keys.map((k) => VALUE_WORDS[k] ?? k);
  return w.length <= 1 ? (w[0] ?? "") : `${w.slice(0, -1).join(", ")} and ${w.at(-1)}`;
}

/** The to-do of a check that needs these values: `enter the grip arm and link arm of "Stick" (still its starting values)`. */
export function enterTodo(node: LinkageNode, keys: readonly string[]): string {
  return `enter the ${valueWords(keys)} of ${nodeLabel(node)} (${keys.length === 1 ? "still its starting value" : "still its starting values"})`;
}

/** The load keys of a part that are unentered: the reason a force carried through it is not the builder's. */
export function unenteredLoadKeys(node: LinkageNode): readonly string[] {
  const keys = LOAD_KEYS[node.kind as NodeKind];
  return keys ? unenteredOf(node, keys) : NONE;
}

const SRC_UNENTERED = { kind: "commonPractice", text: "a margin is computed only from values the builder entered; starting values are not data" } as const;
/** A pushrod's tube material alone (the thread-engagement rule and the rod end's thread check read it). */
export const MATERIAL_KEY = ["material"] as const;
/** A pushrod's tube, as its column and tension allowables need it. */
export const TUBE_KEYS = ["material", "outsideDiameter", "wall", "length"] as const;
/** A cable's strength: its breaking strength and the terminals' efficiency. */
export const TENSION_KEYS = ["size", "construction", "material", "terminalA", "terminalB"] as const;

/**
 * One finding per part with starting values (a note of where a mount is fixed is not data for a check): what
 * they are and what the check leaves undone until they are entered.
 */
export function unenteredFindings(ctx: Ctx, out: Finding[]) {
  for (const node of ctx.nodes) {
    if (!node.unentered) continue;
    const keys = unenteredOf(node).filter((k) => k !== "note");
    if (keys.length === 0) continue;
    const undone: string[] = [];
    if (node.kind === "pushrod" && keys.some((k) => (TUBE_KEYS as readonly string[]).includes(k))) undone.push("its buckling and tension are not checked");
    if (node.kind === "cable" && keys.some((k) => (TENSION_KEYS as readonly string[]).includes(k))) undone.push("its strength is not checked");
    if (unenteredLoadKeys(node).length) undone.push("the loads it passes on are not the builder's, so every margin past it reads \"not checked\"");
    if (undone.length === 0) undone.push("the checks that need them are not made");
    const one = keys.length === 1;
    out.push(finding("values-unentered", "caution", nodeSubject(node.id),
      `${nodeLabel(node)}: the ${valueWords(keys)} ${one ? "is" : "are"} still the starting value${one ? "" : "s"} it was placed with, and ${undone.join("; ")}. Enter ${one ? "it" : "them"} from the plans or the part on its card, or confirm ${one ? "it" : "them"} there if ${one ? "it is" : "they are"} right.`,
      SRC_UNENTERED));
  }
}
