import { defineKind } from "../types";
import type { Props } from "./schema";

export const controlHorn = defineKind<Props>()({
  kind: "controlHorn",
  name: "Control horn",
  hint: "arm on the surface",
  ports: { attach: { side: "left", name: "attach" }, surface: { side: "right", name: "surface" } },
  defaults: () => ({ hornArm: 2.5, linkAngle: 90 }),
  engine: {
    role: "horn",
    // The effective arm of a link at an angle to the horn: hornArm · sin(linkAngle) [from memory; statics].
    effectiveArm: (p) => p.hornArm * Math.abs(Math.sin(((p.linkAngle ?? 90) * Math.PI) / 180)),
  },
});
