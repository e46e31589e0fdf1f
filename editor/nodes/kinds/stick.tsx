import { fmt } from "../../units";
import { arms, opts, STROKE } from "./format";
import { defineEditorKind } from "./types";

export const stick = defineEditorKind({
  kind: "stick",
  glyph: (
    <g {...STROKE}>
      <line x1="10" y1="17" x2="10" y2="6" />
      <rect x="7.5" y="2" width="5" height="5" rx="2" />
      <line x1="6" y1="17" x2="14" y2="17" />
    </g>
  ),
  lines: (p, u) => [arms(p.gripArm, p.attachArm, u, ["grip", "link"]), `${p.axis} · ${p.travelFwd}°/${p.travelAft}°${p.designForce ? ` · ${fmt(p.designForce, "force", u)}` : ""}`],
  fields: [
    { type: "number", path: "props.gripArm", label: "Grip arm", q: "length", required: true, hint: "pivot to hand-grip centre" },
    { type: "number", path: "props.attachArm", label: "Link arm", q: "length", required: true, hint: "pivot to the pushrod hole" },
    { type: "enum", path: "props.axis", label: "Axis", options: opts(["pitch", "roll"] as const), required: true, default: "pitch" },
    { type: "number", path: "props.designForce", label: "Design force override", q: "force", hint: "empty = the build setting" },
    { type: "enum", path: "props.forceSource", label: "Flap or trim force from", options: [["designer", "the designer's figure (above)"], ["leverRule", "the lever rule, grip arm as radius"]], hint: "secondary controls only" },
    { type: "number", path: "props.travelFwd", label: "Forward travel", q: "angle" },
    { type: "number", path: "props.travelAft", label: "Aft travel", q: "angle" },
  ],
});
