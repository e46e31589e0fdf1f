import { STROKE } from "./format";
import { defineEditorKind } from "./types";

export const travelStop = defineEditorKind({
  kind: "travelStop",
  glyph: (
    <g {...STROKE}>
      <rect x="8" y="3" width="4" height="14" rx="1" />
      <path d="M3 10 L7 10 M5 8 L7 10 L5 12" />
    </g>
  ),
  lines: (p) => [`contacts at ${p.stopAt}°`],
  fields: [
    { type: "number", path: "props.stopAt", label: "Contacts at", q: "angle" },
    { type: "number", path: "props.arm", label: "Arm from the pivot", q: "length", hint: "pivot of the part it stops to the contact: the stop load is the moment over this arm" },
  ],
});
