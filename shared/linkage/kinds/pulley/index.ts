import { defineKind } from "../types";
import type { Props } from "./schema";

/** A pulley: the cable joined at `cable` turns over it; it turns on its axle bolt at `pivot` in a bracket on the structure. */
export const pulley = defineKind<Props>()({
  kind: "pulley",
  name: "Pulley",
  hint: "turns a cable, on a bracket",
  ports: { cable: { side: "top", name: "cable" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: () => ({ diameter: 2.5, grooveFor: "1/8" as const, wrapAngle: 90, bearing: "ball" as const }),
  engine: { role: "guide", turn: (p) => p.wrapAngle },
});
