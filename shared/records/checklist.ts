/**
 * The inspection checklist of a linkage revision: per joint the checks its hardware calls for, then the
 * checks of the whole run (full and free travel; stops contact at the designer's travel). Pure.
 * An item's key is (jointId, code); jointId is "" for items of the whole linkage.
 */
import { AN_BOLTS_BY_SIZE, SRC, THREADS_BY_NAME, TORQUE_BY_THREAD, type AnBoltSize } from "../hardware";
import type { Joint, LinkageGraph } from "../linkage/schema";
import { jointName, partName } from "../linkage/names";
import type { Report, SourceTag } from "../analysis/types";
import { CABLE_PART_CODES, cableParts } from "./cable-records";

export const ITEM_CODES = [
  "jam-nut", "witness-hole", "engagement-length", "retaining-washer", "nut-locking", "cotter-pin", "safety-wire",
  "thread-protrusion", "torque", "torque-stripe", "control-sense", "full-free-travel", "stops-before-limits", "not-checked", ...CABLE_PART_CODES,
] as const;
export type ItemCode = (typeof ITEM_CODES)[number];

export type ChecklistItem = {
  /** The joint's id, the part's id for a part of a cable system, "" for the whole linkage (with `code`, the item's key). */
  jointId: string;
  subject: "joint" | "part" | "linkage";
  /** Where, in words: the joint's name ("Forward pushrod B ↔ Bellcrank under the seat, in"), or "Whole linkage". */
  where: string;
  code: ItemCode;
  text: string;
  source: SourceTag;
};

const fmt = (v: number) => String(Number(v.toFixed(3)));

export function jointItems(j: Joint, where: string): ChecklistItem[] {
  const hw = j.hardware;
  const items: ChecklistItem[] = [];
  const add = (code: ItemCode, text: string, source: SourceTag) => items.push({ jointId: j.id, subject: "joint", where, code, text, source });
  const re = hw.rodEnd;
  if (re) {
    add("jam-nut", `Jam nut on the ${re.thread}${re.hand ? ` ${re.hand}` : ""} rod end${re.hand ? "" : " (the same hand as the rod end; record it on the joint card)"} tight against the fitting and marked across nut and fitting.`, SRC.jamNut);
    if (re.hasWitnessHole !== false) add("witness-hole", "Witness hole blocked: a fine wire does not pass through it (the rod end is screwed in far enough).", SRC.engagement);
    else {
      const d = THREADS_BY_NAME[re.thread]?.majorDiameter;
      add("engagement-length", `No witness hole: engaged thread length measured and recorded${d ? ` — at least ${fmt(d)} in in steel, ${fmt(2 * d)} in in aluminium (a rule of thumb; the designer's figure where the drawing gives one)` : ""}.`, SRC.engagement);
    }
    // Shear planes not entered: the inspector looks, since a single-shear rod end needs the washer.
    if (hw.shear === "single" || hw.shear === undefined) {
      const bore = re.housingBore ?? re.ballDiameter;
      add("retaining-washer", `${hw.shear === undefined ? "If the rod end is in single shear (not recorded): r" : "R"}etaining washer fitted ${hw.freeSide === undefined ? "on the rod end's free side (not recorded: under the bolt head or the nut, whichever is against the ball)" : `under the ${hw.freeSide === "nut" ? "nut" : "bolt head"} (the rod end's free side)`}, larger across than the rod end's housing bore${bore ? ` (over ${fmt(bore)} in)` : ""}, so the eye cannot slide off if the ball comes out.`, SRC.retainingWasher);
    }
  }
  const nut = hw.nut;
  // A part turning on the bolt (a bushing, a clevis pin, nothing, or a bolt set free): its castellated nut is snugged, not torqued.
  const turns = hw.fit === "freeToRotate" || hw.bearing === "plainBushing" || hw.bearing === "clevisPin" || hw.bearing === "none";
  if (nut && nut.type !== "none") {
    if (nut.type === "castellatedCotter") add("cotter-pin", `Castellated nut ${turns ? "snugged so the part still turns freely, " : ""}secured with a new cotter pin, legs bent back and trimmed.`, SRC.cotter);
    else if (nut.type === "plainSafetyWire") add("safety-wire", "Nut safety-wired, the wire pulling in the tightening direction.", SRC.nutLocking);
    else if (nut.type === "plain") add("nut-locking", "Plain nut: it is not locked. Replace it with a self-locking nut (where the bolt is clamped and nothing turns on it) or a castellated nut with a new cotter pin, or safety-wire it — not a lock washer, which does not belong in a control run.", SRC.nutLocking);
    else add("nut-locking", "Self-locking nut: the locking feature grips (it cannot be turned by hand), and the bolt is clamped so nothing turns on it — a self-locking nut is not used on a bolt that turns.", SRC.selfLockingRotation);
    if (hw.bolt) add("thread-protrusion", "At least one full thread of the bolt shows past the nut.", SRC.protrusion);
  }
  if (hw.bolt && nut && nut.type !== "none" && !(nut.type === "castellatedCotter" && turns)) {
    const row = hw.bolt.size !== "custom" ? AN_BOLTS_BY_SIZE[hw.bolt.size as AnBoltSize] : undefined;
    const size = row?.size ?? "custom bolt";
    const t = row ? TORQUE_BY_THREAD[row.thread] : undefined;
    const selfLocking = nut.type === "selfLockingMetal" || nut.type === "selfLockingInsert";
    const drag = selfLocking ? (nut.dragTorque !== undefined ? ` plus the measured ${fmt(nut.dragTorque)} in·lbf drag` : " plus the nut's drag torque (measure it and record it)") : "";
    const range = !t ? "the bolt maker's torque"
      : nut.pattern === undefined ? `table 7-1: ${t.tension.min}–${t.tension.max} in·lbf for a tension nut, ${t.shear.min}–${t.shear.max} for a shear (thin) nut (pattern not recorded)${drag}`
      : `table 7-1: ${t[nut.pattern].min}–${t[nut.pattern].max} in·lbf for a ${nut.pattern} nut${drag}`;
    // AC 43.13-1B 7-40f: the slot is lined up within the range, never past it; a washer or nut is changed instead.
    const slot = nut.type === "castellatedCotter" ? "; the cotter-pin slot lined up within that range, starting at its minimum (if it does not line up, a different washer or nut, not more torque)" : "";
    add("torque", hw.torque !== undefined
      ? `${size} nut torqued to ${fmt(hw.torque)} in·lbf — ${range}${slot}.`
      : `${size} nut torqued within ${range}${slot}, and the torque recorded on the joint card (none is recorded).`, nut.type === "castellatedCotter" ? SRC.castleAlign : SRC.torqueTable);
    add("torque-stripe", "Torque stripe across nut, bolt and washer, applied after the torque, unbroken.", { kind: "commonPractice", text: "torque seal marks a torqued fastener" });
  }
  return items;
}

/**
 * What the controls of a run must do, by its system (SRC.controlSense: the 14 CFR 23.779 table): the pilot's motion and
 * the surface's answer, checked on the aircraft with the controls moved by hand.
 */
export function controlSenseText(g: LinkageGraph): string {
  const kinds = new Set(g.nodes.map((n) => n.kind));
  const hand = kinds.has("controlWheel") && !kinds.has("stick") ? "wheel" : kinds.has("controlWheel") ? "stick or wheel" : "stick";
  switch (g.system) {
    case "pitch":
      return `Control sense: ${hand} back raises the nose — the elevator's trailing edge goes up (on a canard, down); ${hand} forward, the opposite. Watched at the surface, not read from the drawing.`;
    case "roll":
      return `Control sense: ${hand} to the right — right aileron's trailing edge up, left aileron's down (right wing down); to the left, the opposite. Watched at both ailerons.`;
    case "yaw":
      return "Control sense: right pedal forward — rudder's trailing edge to the right (nose right); left pedal forward, to the left. Watched at the rudder.";
    case "flap":
      return "Control sense: the flap control forward or up for flaps up, rearward or down for flaps down; at each setting both flaps are at the same angle.";
    case "trim":
      return "Control sense: the trim control moves the way the nose is to go (forward or down for nose down); an elevator's tab goes the other way from the elevator (trailing edge up to trim nose down); the indicator agrees.";
    default:
      return "Control sense: each control moves its surface the way the designer's drawings show, watched at the surface.";
  }
}

/**
 * A surface's travel in the words of the axis it moves about, by its run's system: a rudder (yaw) swings left and
 * right — its card's "up" travel is the trailing edge to the right, as the motion check reads it (shared/linkage/geometry.ts,
 * `surfaceUp`) — and elevators, ailerons, flaps and tabs go up and down.
 */
export function travelText(system: LinkageGraph["system"], up: number, down: number): string {
  return system === "yaw" ? `${down}° left / ${up}° right` : `${up}° up / ${down}° down`;
}

export function linkageItems(g: LinkageGraph): ChecklistItem[] {
  const where = "Whole linkage";
  const surfaces = g.nodes.filter((n) => n.kind === "controlSurface");
  const stops = g.nodes.filter((n) => n.kind === "travelStop");
  const limits = surfaces
    .map((s) => (s.kind === "controlSurface" ? `${partName(s)} ${travelText(g.system, s.props.travelUp, s.props.travelDown)}` : ""))
    .join("; ");
  const items: ChecklistItem[] = [
    { jointId: "", subject: "linkage", where, code: "control-sense", text: controlSenseText(g), source: SRC.controlSense },
    { jointId: "", subject: "linkage", where, code: "full-free-travel", text: "Full and free travel from stop to stop with the controls moved by hand: no binding, rubbing or contact with structure or wiring, at every position.", source: { kind: "commonPractice", text: "control-system inspection" } },
  ];
  if (surfaces.length || stops.length) {
    items.push({
      jointId: "", subject: "linkage", where, code: "stops-before-limits",
      text: `The stops${stops.length ? ` (${stops.map((s) => partName(s)).join(", ")})` : ""} contact at the designer's travel${limits ? ` — ${limits}, within the drawing's tolerance` : ""}; the surface, its horn and the cockpit control reach nothing else first, and nothing else in the run acts as the stop.`,
      source: { kind: "commonPractice", text: "control-system inspection: stops take the load, not the surface" },
    });
  }
  return items;
}

const NOT_CHECKED_SRC: SourceTag = { kind: "commonPractice", text: "a check without its inputs is not made" };

/** The to-do of a joint whose checks could not all be made: what to enter on its card. */
export function notCheckedItem(jointId: string, where: string, todo: readonly string[]): ChecklistItem {
  const list = todo.map((t) => t.charAt(0).toUpperCase() + t.slice(1)).join("; ");
  return { jointId, subject: "joint", where, code: "not-checked", text: `Not checked yet — to do: ${list}. Then save, so the load-path check can make these checks.`, source: NOT_CHECKED_SRC };
}

/**
 * Every item of a revision, joints in graph order (each joint's to-do from the report last), then the parts
 * of a cable system (cables, turnbuckles, pulleys, fairleads), then the whole-linkage items. Without a report
 * the to-do items are left out.
 */
export function checklistFor(g: LinkageGraph, report?: Pick<Report, "joints"> | null): ChecklistItem[] {
  const todo = new Map<string, readonly string[]>();
  for (const r of report?.joints ?? []) if (r.todo?.length) todo.set(r.jointId, r.todo);
  const out: ChecklistItem[] = [];
  for (const j of g.joints) {
    const where = jointName(j, g.nodes);
    for (const i of jointItems(j, where)) out.push(i);
    const t = todo.get(j.id);
    if (t) out.push(notCheckedItem(j.id, where, t));
  }
  for (const { node, where, items } of cableParts(g)) for (const i of items) out.push({ jointId: node.id, subject: "part", where, ...i });
  for (const i of linkageItems(g)) out.push(i);
  return out;
}
