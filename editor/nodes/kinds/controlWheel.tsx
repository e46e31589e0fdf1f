import { fmt } from "../../units";
import { len, lu, opts, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const controlWheel = defineEditorKind({
  kind: "controlWheel",
  glyph: (
    <g {...STROKE}>
      <path d="M3 6 Q10 2 17 6 L17 10 Q10 7 3 10 Z" />
      <line x1="10" y1="8" x2="10" y2="18" />
    </g>
  ),
  lines: (p, u) => [
    `Ø${len(p.diameter, u)} ${lu(u)} · ${p.axis}`,
    p.axis === "roll"
      ? `drum ${len(p.attachArm, u)} ${lu(u)}${p.designCouple ? ` · ${fmt(p.designCouple, "torque", u)}` : ""}`
      : `column ${len(p.columnArm, u)} · link ${len(p.attachArm, u)} ${lu(u)}${p.designForce ? ` · ${fmt(p.designForce, "force", u)}` : ""}`,
  ],
  fields: [
    { type: "enum", path: "props.axis", label: "Axis", options: opts(["pitch", "roll"] as const), required: true, default: "roll" },
    { type: "number", path: "props.diameter", label: "Wheel diameter", q: "length", required: true, hint: "roll couple = 50 × D" },
    { type: "number", path: "props.columnArm", label: "Column arm", q: "length", required: true, hint: "pitch: pivot to wheel centre" },
    { type: "number", path: "props.attachArm", label: "Attach arm", q: "length", required: true, hint: "pitch: to the link; roll: drum radius" },
    { type: "number", path: "props.designForce", label: "Pitch force override", q: "force", hint: "empty = the build setting" },
    { type: "number", path: "props.designCouple", label: "Roll couple override", q: "torque", hint: "empty = the build setting × D" },
  ],
});
