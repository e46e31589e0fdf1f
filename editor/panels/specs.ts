/** The fields of the node properties form and the joint card, section by section. */
import { AN_BOLTS, NUT_TYPES, THREADS, TUBE_MATERIALS, type NodeKind } from "@/shared/linkage/schema";
import type { SectionSpec } from "./SchemaForm";

const opts = <T extends string>(xs: readonly T[], names?: Partial<Record<T, string>>) => xs.map((x) => [x, names?.[x] ?? x] as const);

const PROPS: Record<NodeKind, SectionSpec["fields"]> = {
  stick: [
    { type: "number", path: "props.gripArm", label: "Grip arm", q: "length", required: true, hint: "pivot to hand-grip centre" },
    { type: "number", path: "props.attachArm", label: "Link arm", q: "length", required: true, hint: "pivot to the pushrod hole" },
    { type: "enum", path: "props.axis", label: "Axis", options: opts(["pitch", "roll"] as const), required: true, default: "pitch" },
    { type: "number", path: "props.designForce", label: "Design force override", q: "force", hint: "empty = the build setting" },
    { type: "number", path: "props.travelFwd", label: "Forward travel", q: "angle" },
    { type: "number", path: "props.travelAft", label: "Aft travel", q: "angle" },
  ],
  pedal: [
    { type: "number", path: "props.pedalArm", label: "Pedal arm", q: "length", required: true },
    { type: "number", path: "props.attachArm", label: "Link arm", q: "length", required: true },
    { type: "number", path: "props.designForce", label: "Design force override", q: "force", hint: "empty = the build setting" },
    { type: "number", path: "props.travel", label: "Travel", q: "angle" },
  ],
  torqueTube: [
    { type: "number", path: "props.inputArm", label: "Input arm", q: "length", required: true },
    { type: "number", path: "props.outputArm", label: "Output arm", q: "length", required: true },
  ],
  bellcrank: [
    { type: "number", path: "props.inputArm", label: "Input arm", q: "length", required: true },
    { type: "number", path: "props.outputArm", label: "Output arm", q: "length", required: true },
    { type: "number", path: "props.armAngle", label: "Angle between arms", q: "angle" },
  ],
  idlerArm: [
    { type: "number", path: "props.inputArm", label: "Input arm", q: "length", required: true },
    { type: "number", path: "props.outputArm", label: "Output arm", q: "length", required: true },
  ],
  pushrod: [
    { type: "enum", path: "props.material", label: "Tube material", options: opts(TUBE_MATERIALS), required: true, default: "4130N" },
    { type: "number", path: "props.outsideDiameter", label: "Outside diameter", q: "length", required: true },
    { type: "number", path: "props.wall", label: "Wall thickness", q: "length", required: true },
    { type: "number", path: "props.length", label: "Length, ball to ball", q: "length", required: true },
  ],
  controlHorn: [
    { type: "number", path: "props.hornArm", label: "Horn arm", q: "length", required: true, hint: "hinge line to the pushrod hole" },
    { type: "number", path: "props.linkAngle", label: "Link angle at neutral", q: "angle", hint: "90 = pushrod square to the arm" },
  ],
  controlSurface: [
    { type: "number", path: "props.travelUp", label: "Up travel", q: "angle" },
    { type: "number", path: "props.travelDown", label: "Down travel", q: "angle" },
    { type: "number", path: "props.hingeMoment", label: "Hinge moment", q: "torque", hint: "if the designer gives one" },
  ],
  structureMount: [{ type: "text", path: "props.note", label: "Where it is fixed", placeholder: "e.g. seat-pan rib, station 62" }],
  travelStop: [{ type: "number", path: "props.stopAt", label: "Contacts at", q: "angle" }],
};

export function nodeSections(kind: NodeKind): SectionSpec[] {
  return [
    { title: "Name", fields: [{ type: "text", path: "label", label: "Label", placeholder: "e.g. aft pushrod" }] },
    { title: "Dimensions", fields: PROPS[kind] },
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

export const HARDWARE_SECTIONS: SectionSpec[] = [
  {
    title: "Rod-end bearing",
    optional: "rodEnd",
    fields: [
      { type: "enum", path: "rodEnd.shank", label: "Shank", options: opts(["male", "female"] as const), required: true, default: "male" },
      { type: "enum", path: "rodEnd.thread", label: "Thread (UNF)", options: opts(THREADS), required: true },
      { type: "enum", path: "rodEnd.hand", label: "Thread hand", options: [["RH", "right-hand"], ["LH", "left-hand"]], required: true, default: "RH" },
      { type: "number", path: "rodEnd.ballBore", label: "Ball bore", q: "length", required: true },
      { type: "number", path: "rodEnd.ballDiameter", label: "Ball diameter", q: "length" },
      { type: "number", path: "rodEnd.housingBore", label: "Housing bore", q: "length", hint: "the retaining washer must be larger" },
      { type: "number", path: "rodEnd.ratedUltimate", label: "Rated ultimate radial load", q: "force", hint: "from the maker's data" },
      { type: "number", path: "rodEnd.ratedMisalignment", label: "Rated misalignment ±", q: "angle" },
      { type: "bool", path: "rodEnd.hasWitnessHole", label: "Shank has a witness hole", default: true },
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
      { type: "enum", path: "bolt.material", label: "Material", options: [["steel", "steel"], ["aluminium", "aluminium"]], required: true, default: "steel" },
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
      { type: "enum", path: "nut.pattern", label: "Pattern", options: [["tension", "tension (full)"], ["shear", "shear (thin)"]], required: true, default: "tension" },
      { type: "bool", path: "nut.cotterPinNew", label: "New cotter pin" },
    ],
  },
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
      { type: "enum", path: "fit", label: "Bolt fit", options: [["clamped", "clamped on the race"], ["freeToRotate", "free to rotate"]], required: true, default: "clamped" },
      { type: "enum", path: "shear", label: "Shear", options: [["single", "single"], ["double", "double"]], required: true, default: "double" },
      { type: "enum", path: "bearing", label: "Turns on", options: [["rodEnd", "rod end"], ["ballBearing", "ball bearing"], ["plainBushing", "plain bushing"], ["clevisPin", "clevis pin"], ["none", "nothing (fixed)"]] },
      { type: "number", path: "torque", label: "Applied torque", q: "torque", hint: "including the nut's drag" },
      { type: "bool", path: "torqueStripe", label: "Torque stripe applied" },
      { type: "text", path: "note", label: "Note", multiline: true },
    ],
  },
];
