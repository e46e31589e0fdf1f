import { arms, CRANK_ARMS, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const cableSector = defineEditorKind({
  kind: "cableSector",
  glyph: (
    <g {...STROKE}>
      <path d="M4 15 A8 8 0 0 1 16 15" />
      <line x1="10" y1="16" x2="4" y2="15" />
      <line x1="10" y1="16" x2="16" y2="15" />
      <circle cx="10" cy="16" r="1.4" />
    </g>
  ),
  lines: (p, u) => [arms(p.inputArm, p.sectorRadius, u, ["in", "cables"])],
  fields: [
    CRANK_ARMS[0],
    { type: "number", path: "props.sectorRadius", label: "Sector radius", q: "length", required: true, hint: "pivot to where the cables leave" },
  ],
});
