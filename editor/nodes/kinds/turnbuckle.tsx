import { CABLE_SIZES } from "@/shared/hardware/cables";
import { opts, STROKE } from "./format";
import { defineEditorKind } from "./types";

const shown = (v: number | undefined) => (v === undefined ? "?" : String(v));

export const turnbuckle = defineEditorKind({
  kind: "turnbuckle",
  glyph: (
    <g {...STROKE}>
      <rect x="6" y="7.5" width="8" height="5" rx="2" />
      <line x1="2" y1="10" x2="6" y2="10" />
      <line x1="14" y1="10" x2="18" y2="10" />
    </g>
  ),
  lines: (p) => [`${p.size} in · threads ${shown(p.threadsShowingA)}/${shown(p.threadsShowingB)}`, p.locking === undefined ? "locking not recorded" : p.locking === "none" ? "not safetied" : `safetied: ${p.locking}`],
  fields: [
    { type: "enum", path: "props.size", label: "For cable, in", options: opts(CABLE_SIZES), required: true, default: "1/8" },
    { type: "number", path: "props.threadsShowingA", label: "Threads showing at A", q: "count", hint: "outside the barrel; 3 at most" },
    { type: "number", path: "props.threadsShowingB", label: "Threads showing at B", q: "count" },
    { type: "enum", path: "props.locking", label: "Safetied by", options: [["clip", "locking clips"], ["wire", "safety wire"], ["none", "not yet"]] },
    { type: "enum", path: "props.travelCheck", label: "At full travel both ways", options: [["free", "lines up, cannot bind"], ["binds", "binds or bends"]] },
  ],
});
