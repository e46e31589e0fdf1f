import { STROKE } from "./format";
import { defineEditorKind } from "./types";

export const controlSurface = defineEditorKind({
  kind: "controlSurface",
  glyph: (
    <g {...STROKE}>
      <path d="M3 8 Q5 6 8 7 L17 10 L8 13 Q5 14 3 12 Z" />
    </g>
  ),
  lines: (p) => [`up ${p.travelUp}° · down ${p.travelDown}°`],
  fields: [
    { type: "number", path: "props.travelUp", label: "Up travel", q: "angle", hint: "on a rudder: travel to the right, as the checklist words it" },
    { type: "number", path: "props.travelDown", label: "Down travel", q: "angle", hint: "on a rudder: travel to the left" },
    { type: "number", path: "props.hingeMoment", label: "Hinge moment", q: "torque", hint: "if the designer gives one" },
  ],
});
