"use client";
/**
 * The picture of the run to scale at the back stop, at neutral and at the forward stop, side by side with a
 * title line and the standing caution, as one PNG. The three drawings are the view's own (rendered off
 * screen), serialised and painted onto a canvas.
 */
import { useRef, useState } from "react";
import type { ChainSweep } from "@/shared/analysis/motion";
import type { LinkageGeometry } from "@/shared/linkage/geometry";
import type { LinkageNode } from "@/shared/linkage/schema";
import { CAUTION_TEXT } from "@/shared/caution";
import { ToScale } from "./ToScale";
import { inputWord, PITCH_WORDS, type InputWords, type RodLink, type Turning } from "./model";

const W = 360, H = 220, SCALE = 2;

function esc(t: string) {
  return t.replace(/[&<>"]/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;" })[c]!);
}

export function StopsPicture(props: { geo: LinkageGeometry; parts: Turning[]; rods: RodLink[]; nodes: LinkageNode[]; sw: ChainSweep; steps: [number, number, number]; title: string; words?: InputWords }) {
  const box = useRef<HTMLDivElement>(null);
  const [busy, setBusy] = useState(false);
  const rotAt = (k: number) => {
    const r: Record<string, number> = {};
    props.sw.chain.parts.forEach((p, i) => { r[props.nodes[p]?.id ?? ""] = props.sw.rot[i][k] ?? 0; });
    return r;
  };
  const save = async () => {
    setBusy(true);
    try {
      const svgs = [...box.current!.querySelectorAll("svg")].map((s) => new XMLSerializer().serializeToString(s).replace(/^<svg[^>]*>/, "").replace(/<\/svg>$/, ""));
      const labels = props.steps.map((k) => `${inputWord(props.sw.theta[k], props.words ?? PITCH_WORDS)} · surface ${props.sw.deflection[k].toFixed(1)}°`);
      const total = `<svg xmlns="http://www.w3.org/2000/svg" width="${3 * W * SCALE}" height="${(H + 46) * SCALE}" viewBox="0 0 ${3 * W} ${H + 46}">
<rect width="100%" height="100%" fill="#fff"/><text x="6" y="12" font-size="10" font-family="sans-serif" font-weight="bold">${esc(props.title)} — to scale at ${props.words && props.words !== PITCH_WORDS ? `the ${props.words[1]} stop, neutral and the ${props.words[0]} stop` : "the back stop, neutral and the forward stop"}</text>
${svgs.map((s, i) => `<g transform="translate(${i * W},18)"><svg width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">${s}</svg><text x="6" y="${H + 10}" font-size="9" font-family="sans-serif">${esc(labels[i])}</text></g>`).join("")}
<text x="6" y="${H + 42}" font-size="6" font-family="sans-serif" fill="#475569">${esc(CAUTION_TEXT)}</text></svg>`;
      const img = new Image();
      img.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(total)}`;
      await img.decode();
      const c = document.createElement("canvas");
      c.width = 3 * W * SCALE; c.height = (H + 46) * SCALE;
      c.getContext("2d")!.drawImage(img, 0, 0);
      const blob = await new Promise<Blob | null>((r) => c.toBlob(r, "image/png"));
      if (!blob) return;
      const a = document.createElement("a");
      a.href = URL.createObjectURL(blob);
      a.download = `${props.title.replace(/[^\w.-]+/g, "-") || "linkage"}-travel.png`;
      a.click();
      setTimeout(() => URL.revokeObjectURL(a.href), 1000);
    } finally {
      setBusy(false);
    }
  };
  return (
    <>
      <button type="button" onClick={() => void save()} disabled={busy} className="rounded border border-ink/20 px-2 py-0.5 text-[11px]" data-testid="geometry-picture">
        {busy ? "Drawing…" : "Picture: stops and neutral (PNG)"}
      </button>
      <div ref={box} aria-hidden="true" className="pointer-events-none fixed -left-[4000px] top-0 w-[360px]">
        {props.steps.map((k) => (
          <ToScale key={k} geo={props.geo} parts={props.parts} rods={props.rods} rot={rotAt(k)} readOnly offscreen onMovePivot={() => {}} />
        ))}
      </div>
    </>
  );
}
