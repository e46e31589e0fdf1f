import { fmt } from "../../units";
import { arms, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const pedal = defineEditorKind({
  kind: "pedal",
  glyph: (
    <g {...STROKE}>
      <path d="M5 3 L5 14 L15 17" />
      <circle cx="5" cy="14" r="1.6" />
    </g>
  ),
  lines: (p, u) => [arms(p.pedalArm, p.attachArm, u, ["pedal", "link"]), `travel ${p.travel}°${p.designForce ? ` · ${fmt(p.designForce, "force", u)}` : ""}`],
  fields: [
    { type: "number", path: "props.pedalArm", label: "Pedal arm", q: "length", required: true },
    { type: "number", path: "props.attachArm", label: "Link arm", q: "length", required: true },
    { type: "number", path: "props.designForce", label: "Design force override", q: "force", hint: "empty = the build setting" },
    { type: "number", path: "props.travel", label: "Travel", q: "angle" },
  ],
});
