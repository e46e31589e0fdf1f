/**
 * The inspection checklist of a linkage revision: per joint the checks its hardware calls for, then the
 * checks of the whole run (full and free travel; stops contact before the surface limits). Pure.
 * An item's key is (jointId, code); jointId is "" for items of the whole linkage.
 */
import { AN_BOLTS_BY_SIZE, SRC, THREADS_BY_NAME, type AnBoltSize } from "../hardware";
import type { Joint, LinkageGraph } from "../linkage/schema";
import { jointName, partName } from "../linkage/names";
import type { SourceTag } from "../analysis/types";

export const ITEM_CODES = [
  "jam-nut", "witness-hole", "engagement-length", "retaining-washer", "nut-locking", "cotter-pin", "safety-wire",
  "torque", "torque-stripe", "full-free-travel", "stops-before-limits",
] as const;
export type ItemCode = (typeof ITEM_CODES)[number];

export type ChecklistItem = {
  jointId: string;
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
  const add = (code: ItemCode, text: string, source: SourceTag) => items.push({ jointId: j.id, where, code, text, source });
  const re = hw.rodEnd;
  if (re) {
    add("jam-nut", `Jam nut on the ${re.thread} ${re.hand} rod end tight against the fitting and marked across nut and fitting.`, SRC.jamNut);
    if (re.hasWitnessHole !== false) add("witness-hole", "Witness hole blocked: a fine wire does not pass through it (the rod end is screwed in far enough).", SRC.engagement);
    else {
      const d = THREADS_BY_NAME[re.thread]?.majorDiameter;
      add("engagement-length", `No witness hole: engaged thread length measured and recorded${d ? ` — at least ${fmt(d)} in in steel, ${fmt(2 * d)} in in aluminium` : ""}.`, SRC.engagement);
    }
    if (hw.shear === "single") {
      const bore = re.housingBore ?? re.ballDiameter;
      add("retaining-washer", `Retaining washer fitted under the bolt head, larger across than the rod end's housing bore${bore ? ` (over ${fmt(bore)} in)` : ""}, so the eye cannot slide off if the ball comes out.`, SRC.retainingWasher);
    }
  }
  const nut = hw.nut;
  if (nut && nut.type !== "none") {
    if (nut.type === "castellatedCotter") add("cotter-pin", "Castellated nut secured with a new cotter pin, legs bent back and trimmed.", SRC.cotter);
    else if (nut.type === "plainSafetyWire") add("safety-wire", "Nut safety-wired, the wire pulling in the tightening direction.", SRC.nutLocking);
    else if (nut.type === "plain") add("nut-locking", "Plain nut: a locking device (lock washer, safety wire or jam nut) is present — every fastener in a control run must be locked.", SRC.nutLocking);
    else add("nut-locking", "Self-locking nut: the locking feature grips (it cannot be turned by hand) and at least one full thread shows past the nut.", SRC.protrusion);
  }
  if (hw.bolt && hw.nut?.type !== "castellatedCotter") {
    const size = hw.bolt.size !== "custom" ? AN_BOLTS_BY_SIZE[hw.bolt.size as AnBoltSize]?.size : "custom bolt";
    if (hw.torque !== undefined) add("torque", `${size} nut torqued to ${fmt(hw.torque)} in·lbf (including the nut's drag).`, SRC.torqueTable);
    add("torque-stripe", "Torque stripe across nut, bolt and washer, unbroken.", { kind: "commonPractice", text: "torque seal marks a torqued fastener" });
  }
  return items;
}

export function linkageItems(g: LinkageGraph): ChecklistItem[] {
  const where = "Whole linkage";
  const surfaces = g.nodes.filter((n) => n.kind === "controlSurface");
  const stops = g.nodes.filter((n) => n.kind === "travelStop");
  const limits = surfaces
    .map((s) => (s.kind === "controlSurface" ? `${partName(s)} ${s.props.travelUp}° up / ${s.props.travelDown}° down` : ""))
    .join("; ");
  const items: ChecklistItem[] = [
    { jointId: "", where, code: "full-free-travel", text: "Full and free travel from stop to stop with the controls moved by hand: no binding, rubbing or contact with structure or wiring, at every position.", source: { kind: "commonPractice", text: "control-system inspection" } },
  ];
  if (surfaces.length || stops.length) {
    items.push({
      jointId: "", where, code: "stops-before-limits",
      text: `The stops${stops.length ? ` (${stops.map((s) => partName(s)).join(", ")})` : ""} contact before the surface reaches its limits${limits ? ` — ${limits}` : ""}; nothing else in the run acts as the stop.`,
      source: { kind: "commonPractice", text: "control-system inspection: stops take the load, not the surface" },
    });
  }
  return items;
}

/** Every item of a revision, joints in graph order, then the whole-linkage items. */
export function checklistFor(g: LinkageGraph): ChecklistItem[] {
  return [...g.joints.flatMap((j) => jointItems(j, jointName(j, g.nodes))), ...linkageItems(g)];
}
