import { defineKind } from "../types";
import type { Props } from "./schema";

export const structureMount = defineKind<Props>()({
  kind: "structureMount",
  name: "Structure mount",
  hint: "pivot or bracket on the airframe",
  ports: { mount: { side: "top", name: "mount" } },
  defaults: () => ({ note: "" }),
  engine: { role: "mount" },
});
