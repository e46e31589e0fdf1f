import { z } from "zod";
import { inches } from "../fields";
import { defineKind } from "./types";

/**
 * A cable horn or sector on a crank or torque tube: the input (a pushrod, or the wheel's shaft) on `in`, the
 * circuit's two cables on `out` at the sector radius. It acts as a crank: F_out = F_in · inputArm / radius.
 */
export const cableSector = defineKind({
  kind: "cableSector",
  name: "Cable sector",
  hint: "cable horn or sector on a crank",
  props: z.object({
    inputArm: inches("input arm"),
    /** Pivot to where the cables leave the sector (or to the cable holes of a double horn). */
    sectorRadius: inches("sector radius"),
  }),
  ports: { in: { side: "left", name: "in" }, out: { side: "right", name: "cables" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: () => ({ inputArm: 3, sectorRadius: 3 }),
  engine: {
    role: "crank",
    arms: (p) => [p.inputArm, p.sectorRadius],
    // No arm angle: the two loads are taken as adding, the largest resultant (as idler arms, loads.ts).
    pivotLoad: (fIn, fOut) => fIn + fOut,
  },
});
