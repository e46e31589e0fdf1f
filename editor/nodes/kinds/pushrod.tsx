import { TUBE_MATERIALS } from "@/shared/linkage/format";
import { len, lu, opts, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const pushrod = defineEditorKind({
  kind: "pushrod",
  glyph: (
    <g {...STROKE}>
      <line x1="5" y1="10" x2="15" y2="10" strokeWidth="2.4" />
      <circle cx="3.5" cy="10" r="1.8" />
      <circle cx="16.5" cy="10" r="1.8" />
    </g>
  ),
  lines: (p, u) => [`Ø${len(p.outsideDiameter, u)} × ${len(p.wall, u)} ${lu(u)}`, `${len(p.length, u)} ${lu(u)} · ${p.material}`],
  fields: [
    { type: "enum", path: "props.material", label: "Tube material", options: opts(TUBE_MATERIALS), required: true, default: "4130N" },
    { type: "number", path: "props.outsideDiameter", label: "Outside diameter", q: "length", required: true },
    { type: "number", path: "props.wall", label: "Wall thickness", q: "length", required: true },
    { type: "number", path: "props.length", label: "Length, ball to ball", q: "length", required: true },
  ],
});
