import { len, lu, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const controlHorn = defineEditorKind({
  kind: "controlHorn",
  glyph: (
    <g {...STROKE}>
      <path d="M5 16 L10 4 L15 16 Z" />
      <circle cx="10" cy="7" r="1" />
    </g>
  ),
  lines: (p, u) => [`arm ${len(p.hornArm, u)} ${lu(u)} · ${p.linkAngle}°`],
  fields: [
    { type: "number", path: "props.hornArm", label: "Horn arm", q: "length", required: true, hint: "hinge line to the pushrod hole" },
    { type: "number", path: "props.linkAngle", label: "Link angle at neutral", q: "angle", hint: "90 = pushrod square to the arm" },
    { type: "number", path: "props.boltCount", label: "Bolts to the surface", q: "count", hint: "in one row" },
    { type: "number", path: "props.boltSpacing", label: "Bolt spacing", q: "length", hint: "between neighbouring bolts: they carry the hinge moment's couple" },
  ],
});
