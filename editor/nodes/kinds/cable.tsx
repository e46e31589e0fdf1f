import { CABLE_CONSTRUCTIONS, CABLE_MATERIALS, CABLE_SIZES, CABLE_TERMINALS } from "@/shared/hardware/cables";
import { fmt } from "../../units";
import { opts, STROKE } from "./format";
import { defineEditorKind } from "./types";

const TERMINALS = opts(CABLE_TERMINALS, { swaged: "swaged", nicopress: "nicopress sleeve + thimble", thimble: "thimble + bushing" });
const tension = (v: number | undefined, t: number | undefined, u: "US" | "SI") =>
  v === undefined ? "tension not recorded" : `rigged ${fmt(v, "force", u)}${t === undefined ? "" : ` at ${fmt(t, "temperature", u)}`}`;

export const cable = defineEditorKind({
  kind: "cable",
  glyph: (
    <g {...STROKE}>
      <path d="M3 13 C7 7, 13 13, 17 7" />
      <circle cx="3" cy="13" r="1.4" />
      <circle cx="17" cy="7" r="1.4" />
    </g>
  ),
  lines: (p, u) => [`${p.size} in ${p.construction.replace("x", "×")} ${p.material}`, tension(p.riggingTension, p.riggingTemperature, u)],
  fields: [
    { type: "enum", path: "props.size", label: "Cable size, in", options: opts(CABLE_SIZES), required: true, default: "1/8" },
    { type: "enum", path: "props.construction", label: "Construction", options: opts(CABLE_CONSTRUCTIONS, { "7x19": "7×19", "7x7": "7×7", "1x19": "1×19 (nonflexible)" }), required: true, default: "7x19" },
    { type: "enum", path: "props.material", label: "Material", options: opts(CABLE_MATERIALS, { carbon: "carbon steel", stainless: "corrosion-resisting steel" }), required: true, default: "carbon" },
    { type: "number", path: "props.length", label: "Length", q: "length", hint: "terminal to terminal" },
    { type: "enum", path: "props.terminalA", label: "Terminal at A", options: TERMINALS, required: true, default: "swaged" },
    { type: "enum", path: "props.terminalB", label: "Terminal at B", options: TERMINALS, required: true, default: "swaged" },
    { type: "number", path: "props.riggingTension", label: "Rigging tension", q: "force", hint: "tensiometer reading, converted by its chart" },
    { type: "number", path: "props.riggingTemperature", label: "Measured at", q: "temperature" },
    { type: "number", path: "props.tensionMin", label: "Designer's range, low", q: "force" },
    { type: "number", path: "props.tensionMax", label: "Designer's range, high", q: "force" },
    { type: "number", path: "props.rangeTemperature", label: "Range given at", q: "temperature" },
  ],
});
