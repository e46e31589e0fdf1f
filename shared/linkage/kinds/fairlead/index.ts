import { defineKind } from "../types";
import type { Props } from "./schema";

/** A fairlead: guides a cable through structure; it may turn it a few degrees at most. */
export const fairlead = defineKind<Props>()({
  kind: "fairlead",
  name: "Fairlead",
  hint: "guides a cable, 3° at most",
  ports: { cable: { side: "top", name: "cable" }, mount: { side: "bottom", name: "mount" } },
  defaults: () => ({}),
  engine: { role: "guide", turn: (p) => p.turnAngle },
});
