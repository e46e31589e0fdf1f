import { STROKE } from "./format";
import { defineEditorKind } from "./types";

export const fairlead = defineEditorKind({
  kind: "fairlead",
  glyph: (
    <g {...STROKE}>
      <rect x="6" y="5" width="8" height="10" rx="2" />
      <line x1="2" y1="10" x2="18" y2="10" />
    </g>
  ),
  lines: (p) => [p.turnAngle === undefined ? "turn not recorded" : `turns the cable ${p.turnAngle}°`],
  fields: [{ type: "number", path: "props.turnAngle", label: "Turn through it", q: "angle", hint: "3° at most" }],
});
