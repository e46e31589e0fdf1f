/**
 * Every editor command, once: what it is called, its keys (shown) and key test, what it does, when it is
 * enabled and whether it changes the linkage (off for a read-only viewer). The toolbar, the key handler and
 * the shortcuts sheet all read this list, so a command is added in one place.
 */
import type { EditorState, EditorStore, SubjectRef } from "./store";
import { GRID } from "./canvas/viewport";
import { returnableCable } from "./store/cable";

/** What a command may act on: the store and the editor's own actions. */
export type CommandCtx = {
  store: EditorStore;
  canEdit: boolean;
  fitAll: (o?: { duration?: number }) => void;
  saveNow: () => void;
  toggleSheet: () => void;
  sheetOpen: () => boolean;
  closeSheet: () => void;
  openImport: () => void;
  exportFile: () => void;
  exportPicture: () => void;
  keepPicture: () => void;
  /** Open or close the geometry view (the run to scale and its motion). */
  toggleGeometry: () => void;
  geometryOpen: boolean;
  /** A picture is being drawn or kept. */
  pictureBusy: { exporting: boolean; keeping: boolean };
  /** Select a part or joint and move the focus to its card. */
  openCard: (s: SubjectRef) => void;
  /** If the focus is in the card panel, put it back on the selected part or joint (canvas or list); true if it did. */
  returnFocus: (from: EventTarget | null) => boolean;
  /** Open the keyboard join for the selected part. */
  openJoin: () => void;
  /** Switch between the diagram and the list of the run. */
  toggleList: () => void;
  listOpen: boolean;
};

export type Command = {
  id: string;
  /** What it does, in the sheet and the button's tooltip. */
  label: string;
  /** The keys as shown; absent = no key. */
  keys?: string;
  /** The key test (after the "typing in a field" check unless `whileTyping`). */
  match?: (e: KeyboardEvent) => boolean;
  /** Also while typing in a field (Ctrl/⌘ S). */
  whileTyping?: boolean;
  /** Stop the browser's own action for the key: always, or only when this returns true. */
  preventDefault?: boolean | ((s: EditorState) => boolean);
  /** Changes the linkage: off, and left out of the sheet, for someone who may not edit. */
  edit?: boolean;
  /** When the toolbar button is enabled (the key still reaches `perform`, which does nothing then). */
  enabled?: (s: EditorState, c: CommandCtx) => boolean;
  perform: (c: CommandCtx, e?: KeyboardEvent) => void;
  /**
   * A toolbar button: its group, text and test id; `hidden` leaves it out. `keepsFocus`: while it is off it is
   * marked aria-disabled rather than disabled, so a button that turns itself off while it works (the picture
   * buttons) keeps the keyboard focus instead of dropping it to the page.
   */
  button?: { group: "edit" | "file" | "view" | "help"; text: string | ((c: CommandCtx) => string); testId?: string; hidden?: (c: CommandCtx) => boolean; pressed?: (c: CommandCtx) => boolean; keepsFocus?: boolean };
};

const mod = (e: KeyboardEvent) => e.ctrlKey || e.metaKey;
const key = (e: KeyboardEvent) => e.key.toLowerCase();
const hasSel = (s: EditorState) => s.selection.nodes.length + s.selection.joints.length > 0;
const plain = (e: KeyboardEvent, k: string) => !mod(e) && !e.altKey && !e.shiftKey && key(e) === k;
/** The part or joint a keyboard event's target is on the canvas (React Flow's own wrappers carry data-id). */
export function canvasSubject(t: EventTarget | null): SubjectRef | null {
  const el = t as Element | null;
  if (!el || typeof el.closest !== "function") return null;
  const n = el.closest(".react-flow__node");
  if (n?.getAttribute("data-id")) return { type: "node", id: n.getAttribute("data-id")! };
  const j = el.closest(".react-flow__edge");
  if (j?.getAttribute("data-id")) return { type: "joint", id: j.getAttribute("data-id")! };
  return null;
}
const ARROWS: Record<string, [number, number]> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] };

export const COMMANDS: readonly Command[] = [
  {
    id: "save", label: "Save now", keys: "Ctrl/⌘ S", whileTyping: true, preventDefault: true, edit: true,
    match: (e) => mod(e) && key(e) === "s",
    perform: (c) => c.saveNow(),
    button: { group: "file", text: "Save", testId: "btn-save" },
  },
  {
    id: "openCard", label: "Open the card of the part or joint in focus on the canvas", keys: "Enter / Space",
    match: (e) => (e.key === "Enter" || e.key === " ") && !mod(e) && canvasSubject(e.target) !== null,
    preventDefault: true,
    perform: (c, e) => {
      const s = canvasSubject(e?.target ?? null);
      if (s) c.openCard(s);
    },
  },
  {
    id: "escape", label: "Close this sheet; from a card, back to its part or joint; else clear the selection", keys: "Esc", whileTyping: true,
    match: (e) => e.key === "Escape",
    perform: (c, e) => {
      if (c.sheetOpen()) return c.closeSheet();
      if (c.returnFocus(e?.target ?? null)) return;
      if (!isTyping(e?.target ?? null)) c.store.getState().select(null);
    },
  },
  {
    id: "shortcuts", label: "Keyboard shortcuts (this sheet)", keys: "?", preventDefault: true,
    match: (e) => e.key === "?" || (e.shiftKey && e.key === "/"),
    perform: (c) => c.toggleSheet(),
    button: { group: "help", text: "Keys ?", testId: "btn-shortcuts" },
  },
  {
    id: "selectAll", label: "Select everything", keys: "Ctrl/⌘ A", preventDefault: true,
    match: (e) => mod(e) && key(e) === "a",
    perform: (c) => c.store.getState().selectAll(),
  },
  {
    id: "copy", label: "Copy the selected parts", keys: "Ctrl/⌘ C",
    match: (e) => mod(e) && key(e) === "c",
    perform: (c) => c.store.getState().copy(),
  },
  {
    id: "nextPart", label: "Previous / next part", keys: "[  ]", preventDefault: true,
    match: (e) => e.key === "]" || e.key === "[",
    perform: (c, e) => {
      const s = c.store.getState();
      if (s.nodes.length === 0) return;
      const cur = s.nodes.findIndex((n) => n.id === s.selection.nodes[0]);
      const next = (cur + (e?.key === "[" ? -1 : 1) + s.nodes.length) % s.nodes.length;
      s.select({ type: "node", id: s.nodes[next < 0 ? 0 : next].id });
    },
  },
  {
    id: "undo", label: "Undo", keys: "Ctrl/⌘ Z", preventDefault: true, edit: true,
    match: (e) => mod(e) && key(e) === "z" && !e.shiftKey,
    enabled: (s) => s.past.length > 0,
    perform: (c) => c.store.getState().undo(),
    button: { group: "edit", text: "Undo", testId: "btn-undo" },
  },
  {
    id: "redo", label: "Redo", keys: "Ctrl/⌘ Shift Z, Ctrl/⌘ Y", preventDefault: true, edit: true,
    match: (e) => mod(e) && ((key(e) === "z" && e.shiftKey) || key(e) === "y"),
    enabled: (s) => s.future.length > 0,
    perform: (c) => c.store.getState().redo(),
    button: { group: "edit", text: "Redo", testId: "btn-redo" },
  },
  {
    id: "paste", label: "Paste", keys: "Ctrl/⌘ V", edit: true,
    match: (e) => mod(e) && key(e) === "v",
    perform: (c) => c.store.getState().paste(),
  },
  {
    id: "duplicate", label: "Duplicate the selected parts", keys: "Ctrl/⌘ D", preventDefault: true, edit: true,
    match: (e) => mod(e) && key(e) === "d",
    enabled: hasSel,
    perform: (c) => c.store.getState().duplicate(),
    button: { group: "edit", text: "Duplicate" },
  },
  {
    id: "delete", label: "Delete the selection", keys: "Delete / Backspace", preventDefault: true, edit: true,
    match: (e) => e.key === "Delete" || e.key === "Backspace",
    enabled: hasSel,
    perform: (c) => c.store.getState().deleteSelection(),
    button: { group: "edit", text: "Delete", testId: "btn-delete" },
  },
  {
    id: "fit", label: "Fit the whole linkage in view", keys: "F",
    match: (e) => !mod(e) && key(e) === "f",
    perform: (c) => c.fitAll({ duration: 200 }),
    // The list view has no diagram to fit: no button there (the key does nothing either).
    button: { group: "edit", text: "Fit", testId: "btn-fit", hidden: (c) => c.listOpen },
  },
  {
    id: "returnCable", label: "Add the return cable of the selected cable (or of the joint just drawn to it)", keys: "R", edit: true,
    match: (e) => !mod(e) && !e.altKey && key(e) === "r",
    enabled: (s) => returnableCable(s) !== null,
    perform: (c) => {
      const s = c.store.getState();
      const cable = returnableCable(s);
      if (cable) s.addReturnCable(cable);
      else s.setNotice("Select a cable joined at both ends (or the joint just drawn to it) to add its return cable.");
    },
  },
  {
    id: "join", label: "Join the selected part to another part (pick the two ports)", keys: "J", edit: true,
    match: (e) => plain(e, "j"),
    enabled: (s) => s.selection.nodes.length === 1,
    perform: (c) => {
      const s = c.store.getState();
      if (s.selection.nodes.length === 1) c.openJoin();
      else s.setNotice("Select one part (Enter on it, or choose it in the list) to join it to another.");
    },
    button: { group: "edit", text: "Join…", testId: "btn-join" },
  },
  {
    id: "nudge", label: "Move the selected parts one grid step, each press one undo step (Shift: ×5)", keys: "Arrows", edit: true,
    match: (e) => e.key in ARROWS,
    preventDefault: (s) => s.selection.nodes.length > 0,
    enabled: (s) => s.selection.nodes.length > 0,
    perform: (c, e) => {
      const [dx, dy] = ARROWS[e?.key ?? ""] ?? [0, 0];
      const step = e?.shiftKey ? GRID * 5 : GRID;
      c.store.getState().nudge(dx * step, dy * step);
    },
  },
  {
    id: "import", label: "Replace this linkage with a .json linkage file", keys: "I", edit: true,
    match: (e) => plain(e, "i"),
    perform: (c) => c.openImport(),
    button: { group: "file", text: "Import…", testId: "btn-import" },
  },
  {
    id: "exportFile", label: "Download the linkage file (.json)", keys: "E",
    match: (e) => plain(e, "e"),
    perform: (c) => c.exportFile(),
    button: { group: "file", text: "Export file", testId: "btn-export-json" },
  },
  {
    id: "exportPicture", label: "Download a picture of the whole linkage with its title block", keys: "P",
    match: (e) => plain(e, "p"),
    enabled: (_s, c) => !c.pictureBusy.exporting,
    perform: (c) => {
      if (!c.pictureBusy.exporting) c.exportPicture();
    },
    button: { group: "file", text: (c) => (c.pictureBusy.exporting ? "Drawing…" : "Picture (PNG)"), testId: "btn-export-png", keepsFocus: true },
  },
  {
    id: "keepPicture", label: "Keep the picture on the server as this revision's picture for the build log (unsaved changes are saved first)", keys: "K", edit: true,
    match: (e) => plain(e, "k"),
    enabled: (_s, c) => !c.pictureBusy.keeping,
    perform: (c) => {
      if (!c.pictureBusy.keeping) c.keepPicture();
    },
    button: { group: "file", text: "Keep for the log", testId: "btn-keep-picture", hidden: (c) => !c.canEdit, keepsFocus: true },
  },
  {
    id: "geometry", label: "The run to scale: pivots, arm angles and its motion through the travel", keys: "G",
    match: (e) => plain(e, "g"),
    perform: (c) => c.toggleGeometry(),
    button: { group: "view", text: "Geometry", testId: "btn-geometry", pressed: (c) => c.geometryOpen },
  },
  {
    id: "list", label: "The run as a list along the load path (or back to the diagram)", keys: "L",
    match: (e) => plain(e, "l"),
    perform: (c) => c.toggleList(),
    button: { group: "view", text: (c) => (c.listOpen ? "Diagram" : "List"), testId: "btn-list", pressed: (c) => c.listOpen },
  },
];

function isTyping(t: EventTarget | null) {
  const el = t as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.tagName === "INPUT" || el.tagName === "TEXTAREA" || el.tagName === "SELECT" || el.isContentEditable;
}

/** The key handler: the first command whose key test matches, if the person may use it here. */
export function handleKey(e: KeyboardEvent, c: CommandCtx, commands: readonly Command[] = COMMANDS) {
  const typing = isTyping(e.target);
  for (const cmd of commands) {
    if (!cmd.match || (typing && !cmd.whileTyping) || !cmd.match(e)) continue;
    const s = c.store.getState();
    const pd = typeof cmd.preventDefault === "function" ? cmd.preventDefault(s) : cmd.preventDefault;
    if (pd) e.preventDefault(); // the key belongs to the editor even when its command is off
    if (cmd.edit && !c.canEdit) return;
    cmd.perform(c, e);
    return;
  }
}

/** Mouse gestures and where Tab goes, for the sheet (React Flow and canvas/tab-order.ts handle them; they are not commands). */
export const GESTURES: readonly { keys: string; label: string; edit?: boolean }[] = [
  { keys: "Drag port → port", label: "make a joint", edit: true },
  { keys: "Click / Shift-drag", label: "select / box-select" },
  { keys: "Ctrl/⌘ + click", label: "add to the selection" },
  { keys: "Tab / Shift+Tab", label: "the next / previous part or joint along the run, brought into view" },
];
