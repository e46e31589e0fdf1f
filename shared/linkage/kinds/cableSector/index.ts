import { defineKind } from "../types";
import type { Props } from "./schema";

/**
 * A cable horn or sector on a crank or torque tube: the input (a pushrod, or the wheel's shaft) on `in`, the
 * circuit's two cables on `out` at the sector radius. It acts as a crank: F_out = F_in · inputArm / radius.
 */
export const cableSector = defineKind<Props>()({
  kind: "cableSector",
  name: "Cable sector",
  hint: "cable horn or sector on a crank",
  ports: { in: { side: "left", name: "in" }, out: { side: "right", name: "cables" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: () => ({ inputArm: 3, sectorRadius: 3 }),
  engine: {
    role: "crank",
    arms: (p) => [p.inputArm, p.sectorRadius],
    // No arm angle: the two loads are taken as adding, the largest resultant (as idler arms, loads.ts).
    pivotLoad: (fIn, fOut) => fIn + fOut,
  },
});
