import { CABLE_SIZES } from "@/shared/hardware/cables";
import { len, lu, opts, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const pulley = defineEditorKind({
  kind: "pulley",
  glyph: (
    <g {...STROKE}>
      <circle cx="10" cy="9" r="6" />
      <circle cx="10" cy="9" r="1.5" />
      <line x1="10" y1="15" x2="10" y2="18" />
    </g>
  ),
  lines: (p, u) => [`Ø${len(p.diameter, u)} ${lu(u)} · wrap ${p.wrapAngle}°`, `${p.grooveFor ? `groove ${p.grooveFor} in` : "groove ?"} · ${p.guards === undefined ? "guards ?" : p.guards === "fitted" ? "guarded" : "no guards"}`],
  fields: [
    { type: "number", path: "props.diameter", label: "Diameter", q: "length", required: true, hint: "at the bottom of the groove" },
    { type: "enum", path: "props.grooveFor", label: "Groove made for cable, in", options: opts(CABLE_SIZES) },
    { type: "number", path: "props.wrapAngle", label: "Wrap angle", q: "angle", hint: "how far the cable turns over it" },
    { type: "enum", path: "props.bearing", label: "Bearing", options: [["ball", "ball bearing"], ["plain", "plain bore"]], required: true, default: "ball" },
    { type: "enum", path: "props.guards", label: "Guard pins", options: [["fitted", "fitted"], ["missing", "missing"]] },
    { type: "number", path: "props.guardGap", label: "Guard to flange gap", q: "length" },
    { type: "number", path: "props.ratedLoad", label: "Rated load", q: "force", hint: "from the maker's data" },
  ],
});
