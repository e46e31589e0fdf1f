import { defineKind } from "../types";
import type { Props } from "./schema";

/** A turnbuckle between two cable terminals (or a cable and a fitting): sets the rigging tension, carries tension only. */
export const turnbuckle = defineKind<Props>()({
  kind: "turnbuckle",
  name: "Turnbuckle",
  hint: "sets the cable tension",
  ports: { a: { side: "left", name: "A", end: true }, b: { side: "right", name: "B", end: true } },
  defaults: () => ({ size: "1/8" as const }),
  engine: { role: "tension" },
});
