/** Source tags of the standard tables (domain.md tags). Kept here so every table row can name its source. */
import type { SourceTag } from "../analysis/types";

export const SRC = {
  pilotForces: { kind: "published", text: "14 CFR 23.397(b)" },
  systemLoads: { kind: "published", text: "14 CFR 23.395" },
  dualControls: { kind: "published", text: "14 CFR 23.399 (dual controls, 75 % of each pilot's force)" },
  ultimateFactor: { kind: "published", text: "14 CFR 23.303" },
  fittingFactor: { kind: "published", text: "14 CFR 23.625" },
  highestFactorOnly: { kind: "published", text: "14 CFR 23.619" },
  bearingFactor: { kind: "published", text: "14 CFR 23.693" },
  anBolts: { kind: "fromMemory", text: "AN steel bolt table, 125 ksi tension / 75 ksi shear" },
  aluminiumBolts: { kind: "fromMemory", text: "2024-T4 aluminium bolt shear strength 37 ksi (MIL-HDBK-5)" },
  threads: { kind: "published", text: "ASME B1.1 / handbook tables (tensile stress area)" },
  tubes: { kind: "fromMemory", text: "MIL-HDBK-5 values" },
  column: { kind: "published", text: "Euler / Johnson column, any strength-of-materials text" },
  rodEndRating: { kind: "published", text: "rod-end makers' engineering notes (rating = lowest of race, eye, shank)" },
  statics: { kind: "fromMemory", text: "statics: F_out = F_in · L_in / L_out" },
  torqueTable: { kind: "published", text: "AC 43.13-1B table 7-1" },
  // The maximum-allowable column and the 7/16-20 and 1/2-20 rows were recalled; checked since against the same table
  // as a U.S. Army technical manual reproduces it (TM 9-6150-228-13&P, table H-1): every figure agrees.
  torqueCeiling: { kind: "published", text: "AC 43.13-1B table 7-1, maximum allowable tightening torque column (as reproduced in TM 9-6150-228-13&P table H-1)" },
  torqueTableReproduced: { kind: "published", text: "AC 43.13-1B table 7-1 (row as reproduced in TM 9-6150-228-13&P table H-1)" },
  castleAlign: { kind: "published", text: "AC 43.13-1B 7-40f (castle nut: line the cotter-pin hole up within the torque range plus drag; if it does not line up, change the washer or the nut)" },
  jamNut: { kind: "published", text: "AC 43.13-1B 7-70 (checknut); common practice" },
  engagement: { kind: "commonPractice", text: "thread engagement: witness hole, or 1×D steel / 2×D aluminium" },
  boltClamped: { kind: "commonPractice", text: "bolt clamped on the inner race; the bearing does the moving" },
  selfLockingRotation: { kind: "published", text: "AC 43.13-1B 7-64a: no self-locking nut on parts subject to rotation" },
  selfLockingClamped: { kind: "published", text: "AC 43.13-1B 7-64d: self-locking nuts may be used with anti-friction bearings and control pulleys where the nut and bolt secure the bearing's inner race" },
  retainingWasher: { kind: "commonPractice", text: "large retaining washer on a single-shear rod end" },
  singleShear: { kind: "commonPractice", text: "single shear puts bending in the bolt" },
  protrusion: { kind: "published", text: "AC 43.13-1B 7-37" },
  grip: { kind: "fromMemory", text: "grip length matches the stack (no threads in bearing)" },
  cotter: { kind: "published", text: "AC 43.13-1B 7-38" },
  minBolt: { kind: "published", text: "AC 43.13-1B 7-41" },
  nutLocking: { kind: "commonPractice", text: "every nut in a control run is locked (self-locking, cotter-pinned or safety-wired); cf. 14 CFR 23.607 on removable fasteners, its text not read here" },
  handedEnds: { kind: "commonPractice", text: "one RH and one LH end (cf. AC 43.13-1B 7-165, turnbuckles)" },
  misalignment: { kind: "fromMemory", text: "rod-end rated misalignment, typically ±6° to ±14°" },
  transmission: { kind: "published", text: "mechanism-design texts: transmission angle 40°–140°" },
  // The motion-and-effect table of 14 CFR 23.779 before Part 23 was rewritten in 2017 (rows read in a reprint of the pre-2017 text).
  controlSense: { kind: "published", text: "14 CFR 23.779 (motion and effect of cockpit controls: elevator rearward for nose up, aileron right (clockwise) for right wing down, right pedal forward for nose right; flaps forward or up for flaps up)" },
  structure: { kind: "commonPractice", text: "a control run is a tree of pushrods between mounted cranks" },
  engineering: { kind: "commonPractice", text: "engineering judgement where the published sources are silent" },
} as const satisfies Record<string, SourceTag>;
