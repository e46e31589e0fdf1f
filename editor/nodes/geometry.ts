/**
 * The size of a part card and where its ports sit, computed from the card's CSS (editor/nodes/index.tsx)
 * rather than measured. The canvas only mounts the parts in view; React Flow still needs the size and the
 * port positions of the parts outside it to draw the joints that run off screen, to fit the view and to
 * draw the picture export. A browser test checks these numbers against the measured DOM.
 */
import { PORT_SIDES, type NodeKind, type Side } from "@/shared/linkage/kinds";

export type { Side };
/** Where each port sits on the card (from the kind's ports, shared/linkage/kinds/). */
export { PORT_SIDES };

/** Card: `w-[148px] border-2 py-1.5`, a 16 px title row and one 16 px row per key-number line. */
export const CARD_WIDTH = 148;
const BORDER = 2;
const PAD_Y = 6;
const ROW = 16;
/** Port square: `!h-3 !w-3` (border-box). */
export const PORT_SIZE = 12;

export function cardHeight(lineCount: number): number {
  return 2 * BORDER + 2 * PAD_Y + ROW * (1 + lineCount);
}

/** Fraction along its side where a port sits: ports sharing a side are spread evenly. */
export function portFraction(kind: NodeKind, port: string): { side: Side; f: number } | null {
  const sides = PORT_SIDES[kind] as Record<string, Side>;
  const side = sides[port];
  if (!side) return null;
  const same = Object.keys(sides).filter((p) => sides[p] === side);
  return { side, f: (same.indexOf(port) + 1) / (same.length + 1) };
}

export type PortBox = { id: string; side: Side; x: number; y: number; width: number; height: number };

/**
 * Each port's square relative to the card's top-left corner (border box), as the browser lays it out:
 * the square is positioned against the card's padding box (inside the 2 px border), centred on the edge.
 */
export function portBoxes(kind: NodeKind, size: { width: number; height: number }): PortBox[] {
  const inner = { w: size.width - 2 * BORDER, h: size.height - 2 * BORDER };
  const half = PORT_SIZE / 2;
  return Object.keys(PORT_SIDES[kind]).map((id) => {
    const { side, f } = portFraction(kind, id)!;
    const along = (len: number) => BORDER + len * f - half;
    const box = { id, side, width: PORT_SIZE, height: PORT_SIZE };
    if (side === "left") return { ...box, x: BORDER - half, y: along(inner.h) };
    if (side === "right") return { ...box, x: size.width - BORDER - half, y: along(inner.h) };
    if (side === "top") return { ...box, x: along(inner.w), y: BORDER - half };
    return { ...box, x: along(inner.w), y: size.height - BORDER - half };
  });
}
