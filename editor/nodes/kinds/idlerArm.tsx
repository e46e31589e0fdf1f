import { arms, CRANK_ARMS, ratio, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const idlerArm = defineEditorKind({
  kind: "idlerArm",
  glyph: (
    <g {...STROKE}>
      <line x1="3" y1="10" x2="17" y2="10" />
      <circle cx="10" cy="10" r="2" />
      <circle cx="3.5" cy="10" r="1" />
      <circle cx="16.5" cy="10" r="1" />
    </g>
  ),
  lines: (p, u) => [arms(p.inputArm, p.outputArm, u), `ratio ${ratio(p.inputArm, p.outputArm)}`],
  fields: [...CRANK_ARMS],
});
