/**
 * Joint-card fields of the load-path check v2 (shared/linkage/joint-extras.ts), grouped so a builder fills in
 * what they have: the member at each side of the hole, the stack that sets the bolt's bending, a ball
 * bearing's rating, a clevis pin, the nut's drag torque. Every field is optional; a check whose fields are
 * blank is shown as "not checked" with what to enter.
 */
import { BUSHING_MATERIALS, CLEVIS_RETENTION, PLATE_MATERIALS, ROD_END_BODIES } from "@/shared/linkage/schema";
import { opts } from "../nodes/kinds/format";
import type { FieldSpec, SectionSpec } from "./SchemaForm";

/** The member at one side of the joint's hole, titled with that part's name ("Hole in Bellcrank under the seat"). */
export const member = (side: "from" | "to", part: string): SectionSpec => ({
  title: `Hole in ${part}`,
  optional: `holes.${side}`,
  note: `The arm, lug, horn or bracket of ${part} that the bolt passes through — for bearing and tear-out at its hole. Leave it off for a rod end's own eye.`,
  fields: [
    { type: "enum", path: `holes.${side}.material`, label: "Material", options: opts(PLATE_MATERIALS) },
    { type: "number", path: `holes.${side}.thickness`, label: "Thickness", q: "length", hint: "both cheeks together for a fork" },
    { type: "number", path: `holes.${side}.edgeDistance`, label: "Edge distance", q: "length", hint: "hole centre to the edge, along the load" },
    { type: "number", path: `holes.${side}.cheeks`, label: "Cheeks", q: "count", hint: "2 for a fork or clevis" },
    { type: "enum", path: `holes.${side}.bushing`, label: "Bushed with", options: opts(BUSHING_MATERIALS, { steel: "steel bushing", aluminium: "aluminium bushing" }) },
  ],
});

/** The joint card's sections after the nut; the two hole sections are put in per joint (specs.ts, jointCardSections). */
export const JOINT_EXTRA_SECTIONS: SectionSpec[] = [
  {
    title: "Stack & bearing rating",
    fields: [
      { type: "number", path: "spacers", label: "Washers and spacers at the ball", q: "length", hint: "between the member's face and the ball, each side; 0 if none" },
      { type: "enum", path: "freeSide", label: "Rod end's free side", options: [["head", "bolt head"], ["nut", "nut"]], hint: "where the retaining washer goes" },
      { type: "number", path: "bearingRating", label: "Ball or roller bearing rating", q: "force", hint: "rated radial load, from the maker" },
    ],
  },
  {
    title: "Clevis pin",
    optional: "clevisPin",
    fields: [
      { type: "number", path: "clevisPin.diameter", label: "Pin diameter", q: "length", required: true },
      { type: "number", path: "clevisPin.shearStrength", label: "Pin shear strength (Fsu)", q: "stress", hint: "from the pin's maker" },
      { type: "enum", path: "clevisPin.retention", label: "Retained by", options: opts(CLEVIS_RETENTION, { cotterPinOnly: "a cotter pin only", nutAndCotterPin: "a castellated nut and cotter pin", other: "other (say in the note)" }) },
    ],
  },
];

export const ROD_END_EXTRA_FIELDS: FieldSpec[] = [
  { type: "number", path: "rodEnd.ballWidth", label: "Ball width", q: "length", hint: "along the bolt; sets the bending arm" },
  { type: "enum", path: "rodEnd.bodyMaterial", label: "Body material", options: opts(ROD_END_BODIES, { alloySteel: "alloy steel", stainlessSteel: "stainless steel", carbonSteel: "carbon steel", aluminium: "aluminium" }) },
];

export const NUT_EXTRA_FIELDS: FieldSpec[] = [
  { type: "number", path: "nut.dragTorque", label: "Measured drag torque", q: "torque", hint: "self-locking nut, turning before it seats" },
  { type: "bool", path: "nut.reused", label: "Nut used before" },
];
