/**
 * Picture export for the build log: the whole linkage (not just what is in view), drawn at 2× with
 * html-to-image, on top of a title block (build, linkage, revision, date, findings, caution).
 */
import { getNodesBounds, getViewportForBounds, type Node } from "@xyflow/react";
import { getFontEmbedCSS, toPng } from "html-to-image";
import type { Summary } from "@/shared/analysis/types";

export const EXPORT_WIDTH = 1600;
export const EXPORT_DIAGRAM_HEIGHT = 1000;
export const EXPORT_TITLE_HEIGHT = 190;
export const EXPORT_PIXEL_RATIO = 2;
/** Size of the PNG in device pixels. */
export const EXPORT_SIZE = {
  width: EXPORT_WIDTH * EXPORT_PIXEL_RATIO,
  height: (EXPORT_DIAGRAM_HEIGHT + EXPORT_TITLE_HEIGHT) * EXPORT_PIXEL_RATIO,
};

export type TitleBlock = {
  buildName: string;
  linkageName: string;
  system: string;
  revision: number;
  /** Date of the revision or of the export, shown as given. */
  date: string;
  summary: Summary | null;
  /** e.g. "0.42 (rod end) at Pushrod 1 · a ↔ Bellcrank · in" */
  lowestMarginText?: string;
  caution: string;
  dirty?: boolean;
};

let fontCss: Promise<string> | null = null;

function loadImage(src: string): Promise<HTMLImageElement> {
  return new Promise((resolve, reject) => {
    const img = new Image();
    img.onload = () => resolve(img);
    img.onerror = () => reject(new Error("The diagram picture could not be decoded"));
    img.src = src;
  });
}

function wrap(ctx: CanvasRenderingContext2D, text: string, maxWidth: number): string[] {
  const words = text.split(/\s+/);
  const lines: string[] = [];
  let line = "";
  for (const w of words) {
    const next = line ? `${line} ${w}` : w;
    if (ctx.measureText(next).width > maxWidth && line) {
      lines.push(line);
      line = w;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

function drawTitleBlock(ctx: CanvasRenderingContext2D, t: TitleBlock, y0: number) {
  const W = EXPORT_WIDTH;
  const H = EXPORT_TITLE_HEIGHT;
  const ink = "#1f2a37";
  const soft = "#4b5563";
  ctx.fillStyle = "#f7f5f0";
  ctx.fillRect(0, y0, W, H);
  ctx.strokeStyle = ink;
  ctx.lineWidth = 2;
  ctx.strokeRect(12, y0 + 10, W - 24, H - 22);
  // Column rules
  const cols = [12, 560, 900, 1180, W - 12];
  ctx.lineWidth = 1;
  for (const x of cols.slice(1, -1)) {
    ctx.beginPath();
    ctx.moveTo(x, y0 + 10);
    ctx.lineTo(x, y0 + 100);
    ctx.stroke();
  }
  ctx.beginPath();
  ctx.moveTo(12, y0 + 100);
  ctx.lineTo(W - 12, y0 + 100);
  ctx.stroke();

  const cell = (x: number, label: string, value: string, width: number) => {
    ctx.fillStyle = soft;
    ctx.font = "600 12px Inter, system-ui, sans-serif";
    ctx.fillText(label.toUpperCase(), x + 12, y0 + 32);
    ctx.fillStyle = ink;
    ctx.font = "600 20px Inter, system-ui, sans-serif";
    const lines = wrap(ctx, value, width - 24).slice(0, 2);
    lines.forEach((l, i) => ctx.fillText(l, x + 12, y0 + 58 + i * 24));
  };
  cell(cols[0], "Build", t.buildName, cols[1] - cols[0]);
  cell(cols[1], "Linkage", `${t.linkageName} (${t.system})`, cols[2] - cols[1]);
  cell(cols[2], "Revision", `${t.revision}${t.dirty ? " + unsaved edits" : ""}`, cols[3] - cols[2]);
  cell(cols[3], "Date", t.date, cols[4] - cols[3]);

  ctx.font = "600 14px Inter, system-ui, sans-serif";
  const s = t.summary;
  const counts = s ? `${s.hazard} hazard · ${s.caution} caution · ${s.advisory} advisory` : "not checked";
  ctx.fillStyle = s && s.hazard > 0 ? "#b42318" : ink;
  ctx.fillText(`Findings: ${counts}`, 24, y0 + 124);
  ctx.fillStyle = ink;
  ctx.font = "14px Inter, system-ui, sans-serif";
  ctx.fillText(`Lowest margin: ${t.lowestMarginText ?? "—"}`, 560, y0 + 124);
  ctx.fillStyle = soft;
  ctx.font = "italic 12px Inter, system-ui, sans-serif";
  wrap(ctx, t.caution, W - 48)
    .slice(0, 2)
    .forEach((l, i) => ctx.fillText(l, 24, y0 + 148 + i * 16));
}

/**
 * Draw the whole linkage and its title block into a PNG.
 * `viewportEl` is the canvas's `.react-flow__viewport`; `nodes` are the React Flow nodes with their measured sizes.
 */
export async function exportLinkagePng(opts: { viewportEl: HTMLElement; nodes: Node[]; title: TitleBlock }): Promise<Blob> {
  const { viewportEl, nodes, title } = opts;
  const W = EXPORT_WIDTH;
  const H = EXPORT_DIAGRAM_HEIGHT;
  const pr = EXPORT_PIXEL_RATIO;
  const canvas = document.createElement("canvas");
  canvas.width = W * pr;
  canvas.height = (H + EXPORT_TITLE_HEIGHT) * pr;
  const ctx = canvas.getContext("2d");
  if (!ctx) throw new Error("This browser cannot draw the export picture");
  ctx.scale(pr, pr);
  ctx.fillStyle = "#ffffff";
  ctx.fillRect(0, 0, W, H);

  if (nodes.length > 0) {
    const bounds = getNodesBounds(nodes);
    const vp = getViewportForBounds(bounds, W, H, 0.05, 1.5, 0.06);
    fontCss ??= getFontEmbedCSS(viewportEl).catch(() => "");
    const dataUrl = await toPng(viewportEl, {
      backgroundColor: "#ffffff",
      width: W,
      height: H,
      pixelRatio: pr,
      fontEmbedCSS: await fontCss,
      style: { width: `${W}px`, height: `${H}px`, transform: `translate(${vp.x}px, ${vp.y}px) scale(${vp.zoom})` },
    });
    const img = await loadImage(dataUrl);
    ctx.drawImage(img, 0, 0, W, H);
  } else {
    ctx.fillStyle = "#4b5563";
    ctx.font = "16px Inter, system-ui, sans-serif";
    ctx.fillText("This linkage has no parts yet.", 40, 60);
  }
  drawTitleBlock(ctx, title, H);
  return new Promise((resolve, reject) => canvas.toBlob((b) => (b ? resolve(b) : reject(new Error("PNG encoding failed"))), "image/png"));
}

export function downloadBlob(blob: Blob, filename: string) {
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export function fileSafe(name: string): string {
  return name.replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "linkage";
}
