import { defineKind } from "../types";
import type { Props } from "./schema";
import { TWO_ARM_PORTS, twoArmCrank } from "../two-arm";

export const idlerArm = defineKind<Props>()({
  kind: "idlerArm",
  name: "Idler arm",
  hint: "supports and guides a run",
  ports: TWO_ARM_PORTS,
  defaults: () => ({ inputArm: 3, outputArm: 3 }),
  engine: twoArmCrank,
});
