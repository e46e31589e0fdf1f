/**
 * Joint fields added for the load-path check v2 (every one optional: format version 1 is unchanged and
 * older files read the same). The member at each side of the hole, the stack that sets the bolt's bending
 * arm, ball and roller bearing ratings, clevis pins and the nut's drag torque.
 */
import { z } from "zod";
import { force, inches } from "./fields";

/** Plate and fitting alloys of the member the bolt passes through (shared/hardware/plates.ts has their allowables). */
export const PLATE_MATERIALS = ["4130N", "2024-T3", "6061-T6", "7075-T6"] as const;
export const BUSHING_MATERIALS = ["steel", "aluminium"] as const;

/** One side's member at the hole: the arm, lug, horn or bracket the bolt passes through. */
export const memberSchema = z.object({
  material: z.enum(PLATE_MATERIALS).optional(),
  /** Thickness the bolt bears on: both cheeks together for a fork or clevis, in. */
  thickness: inches("member thickness").optional(),
  /** Hole centre to the member's edge in the direction of the load, in. */
  edgeDistance: inches("edge distance").optional(),
  /** Cheeks the bolt passes through on this side: 2 for a fork or clevis. */
  cheeks: z.union([z.literal(1), z.literal(2)]).optional(),
  /** The hole is bushed, and the bushing's material (the bolt then bears on the bushing). */
  bushing: z.enum(BUSHING_MATERIALS).optional(),
});
export type Member = z.infer<typeof memberSchema>;

/** Rod-end body materials for the shank thread in tension. */
export const ROD_END_BODIES = ["alloySteel", "stainlessSteel", "carbonSteel", "aluminium"] as const;

export const CLEVIS_RETENTION = ["cotterPinOnly", "nutAndCotterPin", "other"] as const;
export const clevisPinSchema = z.object({
  diameter: inches("pin diameter"),
  /** Ultimate shear strength of the pin material from its maker, psi. */
  shearStrength: z.number({ error: "pin shear strength must be a number (psi)" }).positive("pin shear strength must be greater than 0 psi").max(400_000, "pin shear strength over 400,000 psi is not a pin").optional(),
  retention: z.enum(CLEVIS_RETENTION).optional(),
});

/** The fields spread into the joint's hardware schema. */
export const jointExtraFields = {
  /** The member at the hole on the joint's `from` and `to` side. */
  holes: z.object({ from: memberSchema.optional(), to: memberSchema.optional() }).optional(),
  /** Washers and spacers between the member's face and the ball (each side, in double shear), in. */
  spacers: z.number({ error: "spacers must be a number (in)" }).min(0, "spacers cannot be negative").max(10, "spacers over 10 in").optional(),
  /** Which side of the rod end is free (not against the member): the retaining washer goes there. */
  freeSide: z.enum(["head", "nut"]).optional(),
  /**
   * At a surface's hinge: the designer's limit load on this hinge from the surface's own air load, lbf. The
   * check adds the control system's load to it; without it the hinge's checks are not made.
   */
  hingeLoad: force("hinge load").optional(),
  /** Rated radial load of a ball or roller bearing (pivot or hinge), lbf, from its maker. */
  bearingRating: force("bearing rating").optional(),
  clevisPin: clevisPinSchema.optional(),
};

/** Fields added to the rod end. */
export const rodEndExtraFields = {
  /** Width of the ball (inner race) along the bolt, in. */
  ballWidth: inches("ball width").optional(),
  bodyMaterial: z.enum(ROD_END_BODIES).optional(),
};

/** Fields added to the nut. */
export const nutExtraFields = {
  /** Measured drag (prevailing) torque of a self-locking nut, in·lbf. */
  dragTorque: z.number({ error: "drag torque must be a number (in·lbf)" }).min(0, "drag torque cannot be negative").max(1000, "drag torque over 1,000 in·lbf").optional(),
  /** The self-locking nut has been used before. */
  reused: z.boolean().optional(),
};
