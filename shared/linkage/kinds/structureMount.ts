import { z } from "zod";
import { defineKind } from "./types";

export const structureMount = defineKind({
  kind: "structureMount",
  name: "Structure mount",
  hint: "pivot or bracket on the airframe",
  props: z.object({ note: z.string().max(200).default("") }),
  ports: { mount: { side: "top", name: "mount" } },
  defaults: () => ({ note: "" }),
  engine: { role: "mount" },
});
