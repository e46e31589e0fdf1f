import { STROKE } from "./format";
import { defineEditorKind } from "./types";

export const controlSurface = defineEditorKind({
  kind: "controlSurface",
  glyph: (
    <g {...STROKE}>
      <path d="M3 8 Q5 6 8 7 L17 10 L8 13 Q5 14 3 12 Z" />
    </g>
  ),
  // A rudder swings left and right: its "up" travel is the trailing edge to the right, as the motion check and the
  // checklist read it (shared/records/checklist.ts travelText); elevators, ailerons, flaps and tabs go up and down.
  lines: (p, _u, system) => [system === "yaw" ? `left ${p.travelDown}° · right ${p.travelUp}°` : `up ${p.travelUp}° · down ${p.travelDown}°`],
  fields: (system) => [
    ...(system === "yaw"
      ? [
          { type: "number", path: "props.travelDown", label: "Left travel", q: "angle", hint: "trailing edge to the left" },
          { type: "number", path: "props.travelUp", label: "Right travel", q: "angle", hint: "trailing edge to the right" },
        ] as const
      : [
          { type: "number", path: "props.travelUp", label: "Up travel", q: "angle" },
          { type: "number", path: "props.travelDown", label: "Down travel", q: "angle" },
        ] as const),
    { type: "number", path: "props.hingeMoment", label: "Hinge moment", q: "torque", hint: "if the designer gives one" },
  ],
});
