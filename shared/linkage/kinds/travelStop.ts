import { z } from "zod";
import { degrees, inches } from "../fields";
import { defineKind } from "./types";

export const travelStop = defineKind({
  kind: "travelStop",
  name: "Travel stop",
  hint: "limits deflection",
  props: z.object({
    /** The deflection at which the stop contacts, degrees of the part it stops. */
    stopAt: degrees("stop angle").default(15),
    /** Distance from the pivot of the part it stops to the point of contact, in: the stop load is the moment over this arm. */
    arm: inches("stop arm").optional(),
  }),
  ports: { contact: { side: "top", name: "contact" } },
  defaults: () => ({}),
  engine: { role: "stop" },
});
