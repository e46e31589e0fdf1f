"use client";
/**
 * Markers of open review threads over the canvas: a small speech-bubble count at the corner of every
 * node or joint with unresolved comments. Drawn as an overlay that follows the editor's own node and
 * joint elements (found by their data-testid), so the editor needs no change to show them.
 */
import { useEffect, useRef, useState } from "react";
import { useUnresolvedCounts } from "./api";

type Mark = { key: string; type: string; id: string; n: number; x: number; y: number };

export function ReviewMarkers({ buildId, linkageId }: { buildId: string; linkageId: string }) {
  const counts = useUnresolvedCounts(buildId, linkageId);
  const ref = useRef<HTMLDivElement>(null);
  const [marks, setMarks] = useState<Mark[]>([]);
  useEffect(() => {
    let last = "";
    const tick = () => {
      const host = ref.current?.parentElement;
      const canvas = host?.querySelector<HTMLElement>("[data-testid=canvas]");
      if (!host || !canvas) return;
      const h = host.getBoundingClientRect();
      const c = canvas.getBoundingClientRect();
      const out: Mark[] = [];
      for (const [key, n] of Object.entries(counts)) {
        const [type, ...rest] = key.split(":");
        const id = rest.join(":");
        if (type !== "node" && type !== "joint") continue;
        const el = canvas.querySelector<HTMLElement>(`[data-testid="${type}-${CSS.escape(id)}"]`);
        if (!el) continue;
        const r = el.getBoundingClientRect();
        const x = r.right - 4, y = r.top - 8;
        if (x < c.left || x > c.right || y < c.top - 8 || y > c.bottom) continue;
        out.push({ key, type, id, n, x: x - h.left, y: y - h.top });
      }
      const sig = JSON.stringify(out);
      if (sig !== last) {
        last = sig;
        // The same markers as shown keep the same state (no render), also on the first tick of a new effect.
        setMarks((prev) => (JSON.stringify(prev) === sig ? prev : out));
      }
    };
    tick();
    const t = setInterval(tick, 250);
    return () => clearInterval(t);
  }, [counts]);
  return (
    <div ref={ref} className="pointer-events-none absolute inset-0 z-20" aria-hidden="true">
      {marks.map((m) => (
        <span
          key={m.key}
          data-testid={`review-marker-${m.type}-${m.id}`}
          data-count={m.n}
          title={`${m.n} open review thread${m.n === 1 ? "" : "s"}`}
          className="absolute flex h-4 min-w-4 items-center justify-center rounded-full rounded-bl-none bg-advisory px-1 text-[9px] font-bold leading-none text-white shadow"
          style={{ left: m.x, top: m.y }}
        >
          {m.n}
        </span>
      ))}
    </div>
  );
}
