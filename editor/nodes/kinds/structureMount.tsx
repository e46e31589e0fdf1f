import { STROKE } from "./format";
import { defineEditorKind } from "./types";

export const structureMount = defineEditorKind({
  kind: "structureMount",
  glyph: (
    <g {...STROKE}>
      <line x1="3" y1="12" x2="17" y2="12" />
      <line x1="5" y1="12" x2="3" y2="16" />
      <line x1="9" y1="12" x2="7" y2="16" />
      <line x1="13" y1="12" x2="11" y2="16" />
      <line x1="17" y1="12" x2="15" y2="16" />
      <path d="M7 12 L10 6 L13 12" />
    </g>
  ),
  lines: (p) => (p.note ? [p.note] : ["fixed to structure"]),
  fields: [{ type: "text", path: "props.note", label: "Where it is fixed", placeholder: "e.g. seat-pan rib, station 62" }],
});
