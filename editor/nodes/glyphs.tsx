/** Small line drawings of each part kind, drawn for Linkwright (not taken from any other program). */
import type { NodeKind } from "@/shared/linkage/schema";

const P = { fill: "none", stroke: "currentColor", strokeWidth: 1.6, strokeLinecap: "round" as const, strokeLinejoin: "round" as const };

export function KindGlyph({ kind, className = "h-4 w-4" }: { kind: NodeKind; className?: string }) {
  return (
    <svg viewBox="0 0 20 20" className={className} aria-hidden="true">
      {GLYPHS[kind]}
    </svg>
  );
}

const GLYPHS: Record<NodeKind, React.ReactNode> = {
  stick: (
    <g {...P}>
      <line x1="10" y1="17" x2="10" y2="6" />
      <rect x="7.5" y="2" width="5" height="5" rx="2" />
      <line x1="6" y1="17" x2="14" y2="17" />
    </g>
  ),
  pedal: (
    <g {...P}>
      <path d="M5 3 L5 14 L15 17" />
      <circle cx="5" cy="14" r="1.6" />
    </g>
  ),
  torqueTube: (
    <g {...P}>
      <ellipse cx="4" cy="10" rx="1.6" ry="3.2" />
      <line x1="4" y1="6.8" x2="16" y2="6.8" />
      <line x1="4" y1="13.2" x2="16" y2="13.2" />
      <path d="M16 6.8 A1.6 3.2 0 0 1 16 13.2" />
    </g>
  ),
  bellcrank: (
    <g {...P}>
      <path d="M4 4 L10 15 L17 9" />
      <circle cx="10" cy="15" r="2" />
    </g>
  ),
  idlerArm: (
    <g {...P}>
      <line x1="3" y1="10" x2="17" y2="10" />
      <circle cx="10" cy="10" r="2" />
      <circle cx="3.5" cy="10" r="1" />
      <circle cx="16.5" cy="10" r="1" />
    </g>
  ),
  pushrod: (
    <g {...P}>
      <line x1="5" y1="10" x2="15" y2="10" strokeWidth="2.4" />
      <circle cx="3.5" cy="10" r="1.8" />
      <circle cx="16.5" cy="10" r="1.8" />
    </g>
  ),
  controlHorn: (
    <g {...P}>
      <path d="M5 16 L10 4 L15 16 Z" />
      <circle cx="10" cy="7" r="1" />
    </g>
  ),
  controlSurface: (
    <g {...P}>
      <path d="M3 8 Q5 6 8 7 L17 10 L8 13 Q5 14 3 12 Z" />
    </g>
  ),
  structureMount: (
    <g {...P}>
      <line x1="3" y1="12" x2="17" y2="12" />
      <line x1="5" y1="12" x2="3" y2="16" />
      <line x1="9" y1="12" x2="7" y2="16" />
      <line x1="13" y1="12" x2="11" y2="16" />
      <line x1="17" y1="12" x2="15" y2="16" />
      <path d="M7 12 L10 6 L13 12" />
    </g>
  ),
  travelStop: (
    <g {...P}>
      <rect x="8" y="3" width="4" height="14" rx="1" />
      <path d="M3 10 L7 10 M5 8 L7 10 L5 12" />
    </g>
  ),
};
