"use client";
/**
 * The run drawn to scale: a grid in inches (y up), each turning part's pivot with its arms at the step's
 * angles, the pushrods between arm ends, pivot coordinates and rod lengths written beside them. A pivot is
 * dragged with the pointer or moved with the arrow keys when focused (0.1 in; Shift: 1 in).
 */
import { useMemo, useRef } from "react";
import type { LinkageGeometry } from "@/shared/linkage/geometry";
import { armEnd, type RodLink, type Turning } from "./model";

type Props = {
  geo: LinkageGeometry;
  parts: Turning[];
  rods: RodLink[];
  /** Rotation from neutral of each part at the shown step, °. */
  rot: Record<string, number>;
  readOnly: boolean;
  onMovePivot: (id: string, x: number, y: number) => void;
  /** Drawn off screen for the picture: no test ids, nothing to focus. */
  offscreen?: boolean;
};

const W = 360, H = 220, PAD = 18;
const round = (v: number) => Math.round(v * 20) / 20; // 0.05 in

export function ToScale({ geo, parts, rods, rot, readOnly, onMovePivot, offscreen }: Props) {
  const tid = (id: string) => (offscreen ? undefined : id);
  const byId = useMemo(() => new Map(parts.map((p) => [p.id, p])), [parts]);
  const placed = parts.filter((p) => geo.parts[p.id]);
  // The frame: every pivot and every arm end at neutral, so the view does not jump while playing.
  const frame = (() => {
    let x0 = Infinity, x1 = -Infinity, y0 = Infinity, y1 = -Infinity;
    for (const p of placed) {
      const pg = geo.parts[p.id];
      for (const a of p.arms) {
        const r = a.length;
        x0 = Math.min(x0, pg.pivot.x - r); x1 = Math.max(x1, pg.pivot.x + r);
        y0 = Math.min(y0, pg.pivot.y - r); y1 = Math.max(y1, pg.pivot.y + r);
      }
    }
    if (!Number.isFinite(x0)) return { x0: -10, y0: -10, s: (W - 2 * PAD) / 20 };
    const s = Math.min((W - 2 * PAD) / Math.max(1, x1 - x0), (H - 2 * PAD) / Math.max(1, y1 - y0));
    return { x0: x0 - (W - 2 * PAD - (x1 - x0) * s) / (2 * s), y0: y0 - (H - 2 * PAD - (y1 - y0) * s) / (2 * s), s };
  })();
  const X = (x: number) => PAD + (x - frame.x0) * frame.s;
  const Y = (y: number) => H - PAD - (y - frame.y0) * frame.s;
  const svgRef = useRef<SVGSVGElement>(null);
  const drag = useRef<string | null>(null);

  const toInches = (e: React.PointerEvent) => {
    const r = svgRef.current!.getBoundingClientRect();
    const px = ((e.clientX - r.left) / r.width) * W, py = ((e.clientY - r.top) / r.height) * H;
    return { x: round(frame.x0 + (px - PAD) / frame.s), y: round(frame.y0 + (H - PAD - py) / frame.s) };
  };
  // Grid: 1 in lines when they are at least 6 px apart, else 5 in or 10 in.
  const step = frame.s >= 6 ? 1 : frame.s * 5 >= 6 ? 5 : 10;
  const gx: number[] = [], gy: number[] = [];
  for (let x = Math.ceil(frame.x0 / step) * step; X(x) <= W; x += step) gx.push(x);
  for (let y = Math.ceil(frame.y0 / step) * step; Y(y) >= 0; y += step) gy.push(y);

  return (
    <svg ref={svgRef} viewBox={`0 0 ${W} ${H}`} className="h-auto w-full shrink-0 touch-none select-none rounded border border-ink/10 bg-white" data-testid={tid("geometry-view")}
      role="img" aria-label="The run to scale"
      onPointerMove={(e) => { if (drag.current) { const p = toInches(e); onMovePivot(drag.current, p.x, p.y); } }}
      onPointerUp={() => { drag.current = null; }} onPointerLeave={() => { drag.current = null; }}>
      {gx.map((x) => <line key={`x${x}`} x1={X(x)} x2={X(x)} y1={0} y2={H} stroke={x === 0 ? "#94a3b8" : "#eef2f6"} strokeWidth={x % (step * 5) === 0 ? 1 : 0.5} />)}
      {gy.map((y) => <line key={`y${y}`} y1={Y(y)} y2={Y(y)} x1={0} x2={W} stroke={y === 0 ? "#94a3b8" : "#eef2f6"} strokeWidth={y % (step * 5) === 0 ? 1 : 0.5} />)}
      <text x={W - 4} y={H - 4} textAnchor="end" fontSize={8} fill="#64748b">grid {step} in</text>
      {rods.map((r) => {
        const a = r.a && armEnd(geo, byId.get(r.a.node), r.a.port, rot[r.a.node] ?? 0);
        const b = r.b && armEnd(geo, byId.get(r.b.node), r.b.port, rot[r.b.node] ?? 0);
        if (!a || !b) return null;
        const len = Math.hypot(b.x - a.x, b.y - a.y);
        return (
          <g key={r.id} data-testid={tid("geometry-rod")}>
            <line x1={X(a.x)} y1={Y(a.y)} x2={X(b.x)} y2={Y(b.y)} stroke="#1e293b" strokeWidth={2.5} strokeLinecap="round" />
            <text x={(X(a.x) + X(b.x)) / 2} y={(Y(a.y) + Y(b.y)) / 2 - 4} textAnchor="middle" fontSize={8} fill="#334155">{r.name} {len.toFixed(2)} in</text>
          </g>
        );
      })}
      {placed.map((p) => {
        const pg = geo.parts[p.id];
        return (
          <g key={p.id}>
            {p.arms.map((a) => {
              const e = armEnd(geo, p, a.port, rot[p.id] ?? 0);
              return e && <line key={a.port} x1={X(pg.pivot.x)} y1={Y(pg.pivot.y)} x2={X(e.x)} y2={Y(e.y)} stroke={a.port === "grip" ? "#94a3b8" : "#0f766e"} strokeWidth={3} strokeLinecap="round" />;
            })}
            <circle cx={X(pg.pivot.x)} cy={Y(pg.pivot.y)} r={5} fill="#fff" stroke="#0f766e" strokeWidth={2}
              tabIndex={readOnly || offscreen ? -1 : 0} role="button" data-testid={tid(`pivot-${p.id}`)}
              aria-label={`${p.name} pivot at x ${pg.pivot.x}, y ${pg.pivot.y} in${readOnly ? "" : "; arrow keys move it"}`}
              className={readOnly ? "" : "cursor-move focus:outline-none focus-visible:stroke-[#f59e0b]"}
              onPointerDown={(e) => { if (!readOnly) { drag.current = p.id; (e.target as Element).setPointerCapture?.(e.pointerId); } }}
              onKeyDown={(e) => {
                if (readOnly) return;
                const d = e.shiftKey ? 1 : 0.1;
                const m: Record<string, [number, number]> = { ArrowLeft: [-d, 0], ArrowRight: [d, 0], ArrowUp: [0, d], ArrowDown: [0, -d] };
                const mv = m[e.key];
                if (!mv) return;
                e.preventDefault();
                onMovePivot(p.id, round(pg.pivot.x + mv[0]), round(pg.pivot.y + mv[1]));
              }} />
            <text x={X(pg.pivot.x) + 7} y={Y(pg.pivot.y) + 11} fontSize={8} fill="#0f172a">{p.name} ({pg.pivot.x}, {pg.pivot.y})</text>
          </g>
        );
      })}
    </svg>
  );
}
