/**
 * Picture export for the build log: the whole linkage (not just what is in view), drawn at 2× with
 * html-to-image, on top of a title block (build, linkage, revision, date, findings, caution).
 * About 300 lines on purpose: it is one drawing (joints, cards and title block on one canvas, sized together),
 * and its parts share the layout numbers; split, they would only pass those numbers back and forth.
 */
import { getBezierPath, getNodesBounds, getViewportForBounds, Position, type Node } from "@xyflow/react";
import { getFontEmbedCSS, toPng } from "html-to-image";
import type { Severity, Summary } from "@/shared/analysis/types";
import type { Joint, LinkageNode } from "@/shared/linkage/schema";
import { cardSize, PORT_SIDES } from "./nodes";
import { hardwareChips } from "./joints/JointEdge";
import { emptyJointChip } from "./joints/coverage";
import { SEVERITY_HEX } from "./presentation";
import { partName } from "@/shared/linkage/names";

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

/** What the drawn (vector) path needs to paint parts and joints without copying the DOM. */
export type VectorScene = {
  joints: Joint[];
  worstByNode: Record<string, Severity>;
  worstByJoint: Record<string, Severity>;
  lines: (n: LinkageNode) => string[];
};

/**
 * Above this many DOM elements in the viewport, html-to-image (which copies every computed style)
 * gets slow — about 2.6 ms per element in Chromium — so the picture is drawn from the graph instead.
 */
export const DOM_EXPORT_LIMIT = 1200;

type Box = { x: number; y: number; w: number; h: number };
const SIDE_POS: Record<string, Position> = { left: Position.Left, right: Position.Right, top: Position.Top, bottom: Position.Bottom };

function portPoint(n: LinkageNode, box: Box, port: string): { x: number; y: number; pos: Position } {
  const sides = PORT_SIDES[n.kind] as Record<string, string>;
  const side = sides[port] ?? "right";
  const same = Object.keys(sides).filter((p) => sides[p] === side);
  const f = (same.indexOf(port) + 1) / (same.length + 1);
  if (side === "left") return { x: box.x, y: box.y + box.h * f, pos: Position.Left };
  if (side === "right") return { x: box.x + box.w, y: box.y + box.h * f, pos: Position.Right };
  if (side === "top") return { x: box.x + box.w * f, y: box.y, pos: Position.Top };
  return { x: box.x + box.w * f, y: box.y + box.h, pos: SIDE_POS.bottom };
}

function roundRect(ctx: CanvasRenderingContext2D, x: number, y: number, w: number, h: number, r: number) {
  ctx.beginPath();
  ctx.roundRect(x, y, w, h, r);
}

function clip(ctx: CanvasRenderingContext2D, text: string, max: number) {
  if (ctx.measureText(text).width <= max) return text;
  let t = text;
  while (t.length > 1 && ctx.measureText(t + "…").width > max) t = t.slice(0, -1);
  return t + "…";
}

/** Paint parts, joints and badges straight onto the canvas in flow coordinates. */
function drawScene(ctx: CanvasRenderingContext2D, nodes: Node[], scene: VectorScene) {
  const INK = "#1f2a37";
  const boxes = new Map<string, { n: LinkageNode; box: Box }>();
  for (const rn of nodes) {
    const n = (rn.data as { node?: LinkageNode }).node;
    if (!n) continue;
    const size = rn.measured?.width && rn.measured?.height ? rn.measured : cardSize(n);
    boxes.set(rn.id, { n, box: { x: rn.position.x, y: rn.position.y, w: size.width!, h: size.height! } });
  }
  const labels: { x: number; y: number; j: Joint }[] = [];
  ctx.lineCap = "round";
  for (const j of scene.joints) {
    const a = boxes.get(j.from.node);
    const b = boxes.get(j.to.node);
    if (!a || !b) continue;
    const s = portPoint(a.n, a.box, j.from.port);
    const t = portPoint(b.n, b.box, j.to.port);
    const [path, lx, ly] = getBezierPath({ sourceX: s.x, sourceY: s.y, sourcePosition: s.pos, targetX: t.x, targetY: t.y, targetPosition: t.pos });
    const w = scene.worstByJoint[j.id];
    ctx.strokeStyle = w ? SEVERITY_HEX[w] : "#9aa3ad";
    ctx.lineWidth = 2;
    ctx.stroke(new Path2D(path));
    labels.push({ x: lx, y: ly, j });
  }
  for (const { n, box } of boxes.values()) {
    const w = scene.worstByNode[n.id];
    roundRect(ctx, box.x, box.y, box.w, box.h, 6);
    ctx.fillStyle = "#ffffff";
    ctx.fill();
    ctx.lineWidth = 2;
    ctx.strokeStyle = w ? SEVERITY_HEX[w] : "rgba(31,42,55,0.25)";
    ctx.stroke();
    ctx.fillStyle = INK;
    ctx.font = "600 12px Inter, system-ui, sans-serif";
    ctx.fillText(clip(ctx, partName(n), box.w - 36), box.x + 8, box.y + 17);
    ctx.fillStyle = "#4b5563";
    ctx.font = "11px Inter, system-ui, sans-serif";
    scene.lines(n).forEach((l, i) => ctx.fillText(clip(ctx, l, box.w - 16), box.x + 8, box.y + 32 + i * 16));
    if (w) {
      ctx.fillStyle = SEVERITY_HEX[w];
      roundRect(ctx, box.x + box.w - 20, box.y + 6, 14, 14, 3);
      ctx.fill();
    }
  }
  const parts = [...boxes.values()].map((b) => b.n);
  for (const { x, y, j } of labels) {
    const chips = hardwareChips(j.hardware, emptyJointChip(j, parts));
    const w = scene.worstByJoint[j.id];
    ctx.font = "bold 9px Inter, system-ui, sans-serif";
    const widths = chips.map((c) => (c.glyph === "text" ? ctx.measureText(c.text ?? "").width + 4 : 13));
    const total = widths.reduce((a, b) => a + b, 0) + 8;
    roundRect(ctx, x - total / 2, y - 8, total, 16, 8);
    ctx.fillStyle = "#ffffff";
    ctx.fill();
    ctx.lineWidth = 1.5;
    ctx.strokeStyle = w ? SEVERITY_HEX[w] : "#9aa3ad";
    ctx.stroke();
    let cx = x - total / 2 + 4;
    chips.forEach((c, i) => {
      const colour = c.state === "missing" ? "#b54708" : c.quiet ? "#4b5563" : INK;
      ctx.strokeStyle = colour;
      ctx.fillStyle = colour;
      ctx.lineWidth = 1.2;
      ctx.setLineDash(c.state === "missing" ? [2, 1.5] : []);
      if (c.glyph === "text") {
        ctx.fillText(c.text ?? "", cx + 2, y + 3);
      } else {
        ctx.beginPath();
        ctx.arc(cx + 6, y, 4.5, 0, Math.PI * 2);
        ctx.stroke();
        if (c.state === "solid") {
          ctx.beginPath();
          ctx.arc(cx + 6, y, 2, 0, Math.PI * 2);
          ctx.fill();
        }
      }
      ctx.setLineDash([]);
      cx += widths[i];
    });
  }
}

/**
 * Draw the whole linkage and its title block into a PNG.
 * `viewportEl` is the canvas's `.react-flow__viewport`; `nodes` are the React Flow nodes with their measured sizes.
 * Small linkages are copied from the DOM with html-to-image (exactly what is on screen); large ones are
 * drawn from `scene` when given, which keeps a 200-part export well under a second.
 */
export async function exportLinkagePng(opts: { viewportEl: HTMLElement; nodes: Node[]; title: TitleBlock; scene?: VectorScene }): Promise<Blob> {
  const { viewportEl, nodes, title, scene } = opts;
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

  // The canvas mounts only the parts in view: when some are not in the DOM, the picture is drawn from the scene.
  const allMounted = viewportEl.getElementsByClassName("react-flow__node").length >= nodes.length;
  if (nodes.length > 0 && scene && (!allMounted || viewportEl.getElementsByTagName("*").length > DOM_EXPORT_LIMIT)) {
    const bounds = getNodesBounds(nodes);
    const vp = getViewportForBounds(bounds, W, H, 0.02, 1.5, 0.06);
    ctx.save();
    ctx.translate(vp.x, vp.y);
    ctx.scale(vp.zoom, vp.zoom);
    drawScene(ctx, nodes, scene);
    ctx.restore();
  } else if (nodes.length > 0) {
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
  return encodePng(canvas);
}

/**
 * The canvas as a PNG file, encoded now. HTMLCanvasElement.toBlob (and OffscreenCanvas.convertToBlob) hand the
 * encoding to the browser's own schedule, and in Chromium, with the focus kept on the toolbar button that started
 * it, the 200-part picture then waited about 1 s for the same 0.3 MB file (0.2 s before; npm run bench,
 * 2026-12-05). toDataURL encodes at once, on this thread; its text is turned back into bytes here.
 */
function encodePng(canvas: HTMLCanvasElement): Blob {
  const url = canvas.toDataURL("image/png");
  const bin = atob(url.slice(url.indexOf(",") + 1));
  const bytes = new Uint8Array(bin.length);
  for (let i = 0; i < bin.length; i++) bytes[i] = bin.charCodeAt(i);
  return new Blob([bytes], { type: "image/png" });
}
