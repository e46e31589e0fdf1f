/**
 * Where the canvas looks when the editor opens: the subject of a deep link (`?select=<id>` from the
 * hardware list and checklist, `?focus=joint:<id>` / `?focus=node:<id>` from review e-mail), or a first
 * fit that keeps part labels readable. Pure, so it is unit-tested without a browser.
 */
import type { SubjectRef, Viewport } from "./store";

/** The fit used by the Fit button and on open. */
export const FIT = { padding: 0.15, maxZoom: 1.25, minZoom: 0.2 } as const;
/**
 * Below this zoom a part card's 12 px label drops under ~10 px on screen. On open the view does not
 * go below it: a run wider than the canvas opens at its start (the pilot's end, left) and the minimap,
 * Fit and F show the rest.
 */
export const READABLE_ZOOM = 0.8;
/** Screen margin kept around a linkage that is opened at the readable zoom (px). */
export const OPEN_MARGIN = 24;

export type Rect = { x: number; y: number; width: number; height: number };

export type DeepLink = { subject: SubjectRef } | { missing: string } | null;

/**
 * Reads `?focus=joint:<id>` / `?focus=node:<id>` (review e-mail) or `?select=<id>` (a joint or a part id,
 * from the hardware list). `missing` names a subject the link asks for that is not in this revision.
 */
export function readDeepLink(search: string, graph: { nodes: { id: string }[]; joints: { id: string }[] }): DeepLink {
  const q = new URLSearchParams(search);
  const has = (type: "node" | "joint", id: string) => (type === "node" ? graph.nodes : graph.joints).some((x) => x.id === id);
  const focus = q.get("focus")?.trim();
  if (focus) {
    const i = focus.indexOf(":");
    const type = i > 0 ? focus.slice(0, i) : "";
    const id = i > 0 ? focus.slice(i + 1) : focus;
    if (type === "linkage") return null;
    if (type === "node" || type === "joint") return has(type, id) ? { subject: { type, id } } : { missing: `${type === "joint" ? "joint" : "part"} ${id}` };
    // A bare id: whichever it names.
    if (has("joint", focus)) return { subject: { type: "joint", id: focus } };
    if (has("node", focus)) return { subject: { type: "node", id: focus } };
    return { missing: focus };
  }
  const sel = q.get("select")?.trim();
  if (sel) {
    if (has("joint", sel)) return { subject: { type: "joint", id: sel } };
    if (has("node", sel)) return { subject: { type: "node", id: sel } };
    return { missing: sel };
  }
  return null;
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

/** The fitted zoom of `b` in a w×h canvas (React Flow's own rule: padding as a fraction of the bounds). */
export function fitZoom(b: Rect, w: number, h: number, o: { padding: number; minZoom: number; maxZoom: number } = FIT): number {
  const zx = w / Math.max(1, b.width * (1 + o.padding));
  const zy = h / Math.max(1, b.height * (1 + o.padding));
  return clamp(Math.min(zx, zy), o.minZoom, o.maxZoom);
}

/**
 * The viewport the editor opens on: the whole linkage fitted (padding 0.15, at most 1.25×), unless that
 * would shrink labels below READABLE_ZOOM; then READABLE_ZOOM, centred on each axis where the linkage
 * fits and aligned to its left / top edge where it does not.
 */
export function openingViewport(b: Rect, w: number, h: number): Viewport {
  const fitted = fitZoom(b, w, h);
  const zoom = fitted >= READABLE_ZOOM ? fitted : READABLE_ZOOM;
  const axis = (start: number, size: number, screen: number) =>
    size * zoom + 2 * OPEN_MARGIN <= screen || fitted >= READABLE_ZOOM ? screen / 2 - (start + size / 2) * zoom : OPEN_MARGIN - start * zoom;
  return { x: axis(b.x, b.width, w), y: axis(b.y, b.height, h), zoom };
}

/** The zoom a deep-linked subject is shown at: close enough to read its card, never zooming out. */
export function focusZoom(current: number): number {
  return Math.max(current, 1);
}
