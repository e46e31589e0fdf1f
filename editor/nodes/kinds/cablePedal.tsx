import { fmt } from "../../units";
import { arms, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const cablePedal = defineEditorKind({
  kind: "cablePedal",
  glyph: (
    <g {...STROKE}>
      <path d="M5 3 L5 14 L15 17" />
      <circle cx="5" cy="14" r="1.6" />
      <path d="M5 10 C9 9, 13 11, 18 9" strokeDasharray="2 1.5" />
    </g>
  ),
  lines: (p, u) => [arms(p.pedalArm, p.cableArm, u, ["pedal", "cable"]), `travel ${p.travel}°${p.designForce ? ` · ${fmt(p.designForce, "force", u)}` : ""}`],
  fields: [
    { type: "number", path: "props.pedalArm", label: "Pedal arm", q: "length", required: true, hint: "pivot to the ball of the foot" },
    { type: "number", path: "props.cableArm", label: "Cable arm", q: "length", required: true, hint: "pivot to the cable's hole" },
    { type: "number", path: "props.designForce", label: "Design force override", q: "force", hint: "empty = the build setting" },
    { type: "number", path: "props.travel", label: "Travel", q: "angle" },
  ],
});
