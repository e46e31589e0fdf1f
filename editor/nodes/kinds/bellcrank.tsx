import { arms, CRANK_ARMS, ratio, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const bellcrank = defineEditorKind({
  kind: "bellcrank",
  glyph: (
    <g {...STROKE}>
      <path d="M4 4 L10 15 L17 9" />
      <circle cx="10" cy="15" r="2" />
    </g>
  ),
  lines: (p, u) => [arms(p.inputArm, p.outputArm, u), `${p.armAngle}° apart · ${ratio(p.inputArm, p.outputArm)}`],
  fields: [...CRANK_ARMS, { type: "number", path: "props.armAngle", label: "Angle between arms", q: "angle" }],
});
