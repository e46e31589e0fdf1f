import { z } from "zod";
import { degrees } from "../fields";
import { defineKind } from "./types";

/** A fairlead: guides a cable through structure; it may turn it a few degrees at most. */
export const fairlead = defineKind({
  kind: "fairlead",
  name: "Fairlead",
  hint: "guides a cable, 3° at most",
  props: z.object({
    /** The change of the cable's direction through it, degrees. */
    turnAngle: degrees("turn angle").optional(),
  }),
  ports: { cable: { side: "top", name: "cable" }, mount: { side: "bottom", name: "mount" } },
  defaults: () => ({}),
  engine: { role: "guide", turn: (p) => p.turnAngle },
});
