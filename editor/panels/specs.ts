/** The fields of the node properties form (each kind's own, editor/nodes/kinds/) and the joint card, section by section. */
import { AN_BOLTS, NUT_TYPES, THREADS, type NodeKind } from "@/shared/linkage/schema";
import { EDITOR_KINDS } from "../nodes/kinds";
import { kindFields } from "../nodes/kinds/types";
import { opts } from "../nodes/kinds/format";
import type { SectionSpec } from "./SchemaForm";
import { JOINT_EXTRA_SECTIONS, NUT_EXTRA_FIELDS, ROD_END_EXTRA_FIELDS, member } from "./joint-sections";
import { ROLES } from "@/shared/linkage/kinds";
import { partName } from "@/shared/linkage/names";
import type { ControlSystem, Joint, LinkageNode } from "@/shared/linkage/schema";

export function nodeSections(kind: NodeKind, system: ControlSystem): SectionSpec[] {
  return [
    { title: "Name", fields: [{ type: "text", path: "label", label: "Label", placeholder: "e.g. aft pushrod" }] },
    { title: "Dimensions", fields: kindFields(EDITOR_KINDS[kind] as never, system) },
  ];
}

const NUT_NAMES: Record<(typeof NUT_TYPES)[number], string> = {
  selfLockingMetal: "Self-locking, all-metal",
  selfLockingInsert: "Self-locking, fibre/nylon insert",
  castellatedCotter: "Castellated + cotter pin",
  plainSafetyWire: "Plain + safety wire",
  plain: "Plain, no locking",
  none: "None",
};

/** Where the two hole sections go in the card (jointCardSections puts them in with the parts' names). */
const HOLES: SectionSpec = { title: "", fields: [] };

export const HARDWARE_SECTIONS: SectionSpec[] = [
  {
    title: "Rod-end bearing",
    optional: "rodEnd",
    fields: [
      { type: "enum", path: "rodEnd.shank", label: "Shank", options: opts(["male", "female"] as const), required: true, default: "male" },
      { type: "enum", path: "rodEnd.thread", label: "Thread (UNF)", options: opts(THREADS), required: true },
      { type: "enum", path: "rodEnd.hand", label: "Thread hand", options: [["RH", "right-hand"], ["LH", "left-hand"]], unsetHint: "unset, the hardware list and checklist ask for it (the jam nut has the same hand)" },
      { type: "number", path: "rodEnd.ballBore", label: "Ball bore", q: "length", required: true },
      { type: "number", path: "rodEnd.ballDiameter", label: "Ball diameter", q: "length" },
      { type: "number", path: "rodEnd.housingBore", label: "Housing bore", q: "length", hint: "the retaining washer must be larger" },
      { type: "number", path: "rodEnd.ratedUltimate", label: "Rated ultimate radial load", q: "force", hint: "from the maker's data" },
      { type: "number", path: "rodEnd.ratedMisalignment", label: "Rated misalignment ±", q: "angle" },
      { type: "bool", path: "rodEnd.hasWitnessHole", label: "Shank has a witness hole", default: true },
      ...ROD_END_EXTRA_FIELDS,
      { type: "text", path: "rodEnd.partNumber", label: "Part number" },
    ],
  },
  {
    title: "Jam nut & thread engagement",
    dropWhenEmpty: ["jamNut", "engagement"],
    fields: [
      { type: "bool", path: "jamNut.fitted", label: "Jam nut fitted" },
      { type: "bool", path: "jamNut.tightened", label: "Jam nut tightened" },
      { type: "bool", path: "engagement.witnessHoleVerified", label: "Witness hole checked (no gap)" },
      { type: "number", path: "engagement.engagedLength", label: "Engaged thread length", q: "length" },
    ],
  },
  {
    title: "Bolt",
    optional: "bolt",
    fields: [
      { type: "enum", path: "bolt.size", label: "Size", options: [...opts(AN_BOLTS), ["custom", "other"]], required: true },
      { type: "number", path: "bolt.diameter", label: "Shank diameter", q: "length", hint: "filled from the AN size" },
      { type: "enum", path: "bolt.material", label: "Material", options: [["steel", "steel"], ["aluminium", "aluminium"]], unsetHint: "unset, an AN bolt counts as steel; another bolt's strength is not checked" },
      { type: "number", path: "bolt.grip", label: "Grip length", q: "length" },
      { type: "number", path: "bolt.stack", label: "Clamped stack", q: "length" },
      { type: "number", path: "bolt.threadsProtruding", label: "Threads past the nut", q: "count" },
    ],
  },
  {
    title: "Nut",
    optional: "nut",
    fields: [
      { type: "enum", path: "nut.type", label: "Type and locking", options: opts(NUT_TYPES, NUT_NAMES), required: true },
      { type: "enum", path: "nut.pattern", label: "Pattern", options: [["tension", "tension (full)"], ["shear", "shear (thin)"]], unsetHint: "unset, the torque is not judged against a range" },
      { type: "bool", path: "nut.cotterPinNew", label: "New cotter pin" },
      ...NUT_EXTRA_FIELDS,
    ],
  },
  HOLES,
  ...JOINT_EXTRA_SECTIONS,
  {
    title: "Washer under the bolt head",
    optional: "washerUnderHead",
    note: "At a rod end this washer keeps the bolt from leaving if the ball lets go: its outside diameter must exceed the housing bore.",
    fields: [
      { type: "number", path: "washerUnderHead.outsideDiameter", label: "Outside diameter", q: "length", required: true },
      { type: "number", path: "washerUnderHead.thickness", label: "Thickness", q: "length" },
    ],
  },
  {
    title: "Washer under the nut",
    optional: "washerUnderNut",
    fields: [
      { type: "number", path: "washerUnderNut.outsideDiameter", label: "Outside diameter", q: "length", required: true },
      { type: "number", path: "washerUnderNut.thickness", label: "Thickness", q: "length" },
    ],
  },
  {
    title: "Fit, torque & marks",
    fields: [
      { type: "enum", path: "fit", label: "Bolt fit", options: [["clamped", "clamped on the race"], ["freeToRotate", "free to rotate"]], unsetHint: "unset at a rod end, whether the bolt turns in the ball is not checked" },
      { type: "enum", path: "shear", label: "Shear", options: [["single", "single"], ["double", "double"]], unsetHint: "unset, the fastener's shear is not checked" },
      { type: "enum", path: "bearing", label: "Turns on", options: [["rodEnd", "rod end"], ["ballBearing", "ball bearing"], ["plainBushing", "plain bushing"], ["clevisPin", "clevis pin"], ["none", "nothing (fixed)"]] },
      { type: "number", path: "torque", label: "Applied torque", q: "torque", hint: "including the nut's drag" },
      { type: "bool", path: "torqueStripe", label: "Torque stripe applied" },
      { type: "bool", path: "lockWasher", label: "Split or tooth lock washer in the stack", hint: "none belongs in a control run" },
      { type: "text", path: "note", label: "Note", multiline: true },
    ],
  },
];

const ROD_END_ONLY = new Set(["Rod-end bearing", "Jam nut & thread engagement"]);

/**
 * The joint card of one joint: the holes titled with the two parts' names; at a cable's or turnbuckle's
 * terminal (the terminal and the turnbuckle are on those parts' own cards) no rod-end or jam-nut section,
 * unless a rod end was recorded there before.
 */
/** At a surface's hinge, first on the card: the load the check cannot find for itself. */
export const HINGE_SECTION: SectionSpec = {
  title: "Hinge load",
  note: "The surface's own air load on this hinge comes from the designer's data, not from the run. The check adds the control system's load to it; without it this hinge is not checked.",
  fields: [{ type: "number", path: "hingeLoad", label: "Designer's hinge load (limit)", q: "force", hint: "on this hinge, from the designer's data" }],
};

export function jointCardSections(joint: Joint, nodes: readonly LinkageNode[]): SectionSpec[] {
  const byId = (id: string) => nodes.find((n) => n.id === id);
  const from = byId(joint.from.node), to = byId(joint.to.node);
  const cableEnd = [from, to].some((n) => n && ROLES[n.kind] === "tension") && !joint.hardware.rodEnd;
  const out: SectionSpec[] = [];
  if ((from?.kind === "controlSurface" && joint.from.port === "hinge") || (to?.kind === "controlSurface" && joint.to.port === "hinge")) out.push(HINGE_SECTION);
  for (const s of HARDWARE_SECTIONS) {
    if (s === HOLES) {
      out.push(member("from", from ? partName(from) : "the first part"), member("to", to ? partName(to) : "the second part"));
      continue;
    }
    if (cableEnd && ROD_END_ONLY.has(s.title)) continue;
    out.push(s);
  }
  return out;
}
