import { z } from "zod";
import { degrees, force, inches } from "../fields";
import { CABLE_SIZES } from "../../hardware/cables";
import { defineKind } from "./types";

/** A pulley: the cable joined at `cable` turns over it; it turns on its axle bolt at `pivot` in a bracket on the structure. */
export const pulley = defineKind({
  kind: "pulley",
  name: "Pulley",
  hint: "turns a cable, on a bracket",
  props: z.object({
    /** Diameter at the bottom of the groove, in. */
    diameter: inches("diameter"),
    /** The cable size its groove is made for. */
    grooveFor: z.enum(CABLE_SIZES).optional(),
    /** The angle the cable turns through over it (0 = straight on, 180 = back the way it came). */
    wrapAngle: degrees("wrap angle").default(90),
    bearing: z.enum(["ball", "plain"]).default("ball"),
    /** Guard pins (or a guard) at the groove: fitted or missing. */
    guards: z.enum(["fitted", "missing"]).optional(),
    /** Widest gap between a guard and the pulley's flange, in. */
    guardGap: inches("guard gap").optional(),
    /** The maker's allowable load on the pulley, lbf. */
    ratedLoad: force("rated load").optional(),
  }),
  ports: { cable: { side: "top", name: "cable" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: () => ({ diameter: 2.5, grooveFor: "1/8" as const, wrapAngle: 90 }),
  engine: { role: "guide", turn: (p) => p.wrapAngle },
});
