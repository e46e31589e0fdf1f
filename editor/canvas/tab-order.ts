"use client";
/**
 * Tab on the canvas goes along the run (shared/linkage/order.ts, the order of the list view): from the input
 * through each part and the joints that lead on from it, instead of the drawing's document order (React Flow
 * puts every joint before every part). Tab into the canvas lands on the run's first item (Shift+Tab on its
 * last); Tab past either end leaves the canvas for the Tab stop beside it. An item out of view (only what is
 * in view is drawn) is brought into view first. Only a part's or a joint's own element is taken over: a
 * control inside a part keeps the browser's order.
 */
import { useCallback, useEffect, useRef } from "react";
import { useReactFlow } from "@xyflow/react";
import { runOrder, type RunItem } from "@/shared/linkage/order";
import { useEditorStoreApi } from "../context";
import type { EditorState } from "../store";
import { subjectCentre } from "./viewport";

const ITEM = ".react-flow__node, .react-flow__edge";
const TABBABLE = 'a[href], button:not([disabled]), input:not([disabled]):not([type="hidden"]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])';
/** How long to wait for an item brought into view to be drawn. */
const DRAW_MS = 500;

type Order = { nodes: EditorState["nodes"]; joints: EditorState["joints"]; order: RunItem[]; index: Map<string, number> };
const keyOf = (it: { type: string; id: string }) => `${it.type}:${it.id}`;

/** The part or joint whose own element `el` is, or null. */
function itemOf(el: EventTarget | null): { type: "node" | "joint"; id: string } | null {
  const e = el as Element | null;
  if (!e || typeof e.closest !== "function") return null;
  const item = e.closest(ITEM);
  const id = item?.getAttribute("data-id");
  if (!item || item !== e || !id) return null;
  return { type: item.classList.contains("react-flow__node") ? "node" : "joint", id };
}

const shown = (el: Element) => el.getClientRects().length > 0 && !el.closest("[inert], [hidden], [aria-hidden='true']");

export function useRunTabOrder(wrap: React.RefObject<HTMLDivElement | null>) {
  const api = useEditorStoreApi();
  const rf = useReactFlow();
  const cache = useRef<Order | null>(null);
  /** The direction of a Tab press whose focus move has not happened yet (cleared after the press's task). */
  const tabbing = useRef<"forward" | "back" | null>(null);

  const orderOf = useCallback((): Order => {
    const s = api.getState();
    const c = cache.current;
    if (c && c.nodes === s.nodes && c.joints === s.joints) return c;
    const order = runOrder(s);
    return (cache.current = { nodes: s.nodes, joints: s.joints, order, index: new Map(order.map((it, i) => [keyOf(it), i])) });
  }, [api]);

  const elementFor = useCallback((it: RunItem) => {
    const cls = it.type === "node" ? "react-flow__node" : "react-flow__edge";
    return wrap.current?.querySelector<HTMLElement | SVGElement>(`.${cls}[data-id="${CSS.escape(it.id)}"]`) ?? null;
  }, [wrap]);

  /**
   * The item the focus is on its way to (brought into view, not drawn yet): a second Tab goes on from it, and
   * any other key or a pointer press calls the move off, so a late focus never takes the builder elsewhere.
   */
  const pending = useRef<{ item: RunItem; move: number } | null>(null);
  const moves = useRef(0);

  const focusItem = useCallback((it: RunItem) => {
    const move = ++moves.current;
    pending.current = null;
    const el = elementFor(it);
    if (el) return el.focus();
    pending.current = { item: it, move };
    const p = subjectCentre(api.getState(), it);
    if (p) void rf.setCenter(p.x, p.y, { zoom: rf.getZoom(), duration: 0 });
    const until = performance.now() + DRAW_MS;
    const draw = () => {
      if (moves.current !== move) return;
      const e = elementFor(it);
      if (e) {
        pending.current = null;
        e.focus();
      } else if (performance.now() < until) requestAnimationFrame(draw);
      else pending.current = null;
    };
    requestAnimationFrame(draw);
  }, [api, rf, elementFor]);

  /** Focus the Tab stop just after (or before) the canvas's parts and joints; false when there is none. */
  const leave = useCallback((back: boolean) => {
    moves.current++;
    pending.current = null;
    const viewport = wrap.current?.querySelector(".react-flow__viewport");
    if (!viewport) return false;
    const stops = [...document.querySelectorAll<HTMLElement>(TABBABLE)].filter((el) => !el.closest(ITEM) && !viewport.contains(el) && shown(el));
    const side = back ? Node.DOCUMENT_POSITION_PRECEDING : Node.DOCUMENT_POSITION_FOLLOWING;
    const beside = stops.filter((el) => viewport.compareDocumentPosition(el) & side);
    const to = back ? beside.at(-1) : beside[0];
    to?.focus();
    return !!to;
  }, [wrap]);

  // Which way a Tab press goes, wherever it starts (the toolbar before the canvas, the zoom buttons after it).
  useEffect(() => {
    const callOff = () => {
      moves.current++;
      pending.current = null;
    };
    // The focus moves in the Tab key's default action, before its key-up: the direction is known only until then
    // (a timer alone is not enough: the browser runs the next key press before a waiting timer).
    const settled = () => { tabbing.current = null; };
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== "Tab" || e.altKey || e.ctrlKey || e.metaKey) {
        settled();
        if (e.key !== "Shift") callOff();
        return;
      }
      tabbing.current = e.shiftKey ? "back" : "forward";
      setTimeout(settled, 0);
    };
    document.addEventListener("keydown", onKey, true);
    document.addEventListener("keyup", settled, true);
    document.addEventListener("pointerdown", callOff, true);
    return () => {
      document.removeEventListener("keydown", onKey, true);
      document.removeEventListener("keyup", settled, true);
      document.removeEventListener("pointerdown", callOff, true);
    };
  }, []);

  /** On the wrapper, in the capture phase: Tab from a part or joint goes to the next item along the run. */
  const onKeyDownCapture = useCallback((e: React.KeyboardEvent) => {
    if (e.key !== "Tab" || e.altKey || e.ctrlKey || e.metaKey) return;
    const it = itemOf(e.target) && (pending.current?.item ?? itemOf(e.target));
    if (!it) return;
    const { order, index } = orderOf();
    const i = index.get(keyOf(it));
    if (i === undefined) return;
    const j = i + (e.shiftKey ? -1 : 1);
    if (j >= 0 && j < order.length) {
      e.preventDefault();
      focusItem(order[j]);
    } else if (leave(e.shiftKey)) e.preventDefault();
  }, [orderOf, focusItem, leave]);

  /** Tab into the canvas from outside it starts at the run's first item, Shift+Tab at its last. */
  const onFocusCapture = useCallback((e: React.FocusEvent) => {
    const dir = tabbing.current;
    if (!dir || itemOf(e.relatedTarget) || !itemOf(e.target)) return;
    const { order } = orderOf();
    const want = dir === "back" ? order.at(-1) : order[0];
    const it = itemOf(e.target)!;
    if (want && keyOf(want) !== keyOf(it)) focusItem(want);
  }, [orderOf, focusItem]);

  return { onKeyDownCapture, onFocusCapture };
}
