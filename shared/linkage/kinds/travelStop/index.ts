import { defineKind } from "../types";
import type { Props } from "./schema";

export const travelStop = defineKind<Props>()({
  kind: "travelStop",
  name: "Travel stop",
  hint: "limits deflection",
  ports: { contact: { side: "top", name: "contact" } },
  defaults: () => ({ stopAt: 15 }),
  engine: { role: "stop" },
});
