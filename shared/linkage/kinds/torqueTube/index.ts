import { defineKind } from "../types";
import type { Props } from "./schema";
import { TWO_ARM_PORTS, twoArmCrank } from "../two-arm";

export const torqueTube = defineKind<Props>()({
  kind: "torqueTube",
  name: "Torque tube",
  hint: "turns one arm into another",
  ports: TWO_ARM_PORTS,
  defaults: () => ({ inputArm: 3, outputArm: 3 }),
  engine: twoArmCrank,
});
