import { arms, CRANK_ARMS, ratio, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const torqueTube = defineEditorKind({
  kind: "torqueTube",
  glyph: (
    <g {...STROKE}>
      <ellipse cx="4" cy="10" rx="1.6" ry="3.2" />
      <line x1="4" y1="6.8" x2="16" y2="6.8" />
      <line x1="4" y1="13.2" x2="16" y2="13.2" />
      <path d="M16 6.8 A1.6 3.2 0 0 1 16 13.2" />
    </g>
  ),
  lines: (p, u) => [arms(p.inputArm, p.outputArm, u), `ratio ${ratio(p.inputArm, p.outputArm)}`],
  fields: [...CRANK_ARMS],
});
