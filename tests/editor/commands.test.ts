/**
 * The editor's one command list (editor/commands.ts) drives the keys, the toolbar and the shortcuts sheet.
 * Keys are checked against a real editor store: each does what its command says, editing keys do nothing
 * for someone who may not edit, and no key event is claimed by two commands.
 */
import { describe, expect, it } from "vitest";
import { COMMANDS, handleKey, type CommandCtx } from "@/editor/commands";
import { createEditorStore } from "@/editor/store";
import { demoPitchLinkage } from "@/shared/demo";
import { GRID } from "@/editor/canvas/viewport";

type Key = { key: string; ctrlKey?: boolean; metaKey?: boolean; shiftKey?: boolean; target?: unknown };
function press(ctx: CommandCtx, k: Key) {
  let prevented = false;
  const e = { ctrlKey: false, metaKey: false, shiftKey: false, target: null, ...k, preventDefault: () => (prevented = true) } as unknown as KeyboardEvent;
  handleKey(e, ctx);
  return prevented;
}

function setup(canEdit = true) {
  const store = createEditorStore(demoPitchLinkage(), { readOnly: !canEdit, now: () => 0 });
  const calls: string[] = [];
  let sheet = false;
  const ctx: CommandCtx = {
    store, canEdit,
    fitAll: () => calls.push("fit"),
    saveNow: () => calls.push("save"),
    toggleSheet: () => (sheet = !sheet),
    sheetOpen: () => sheet,
    closeSheet: () => (sheet = false),
    openImport: () => calls.push("import"),
    exportFile: () => calls.push("exportFile"),
    exportPicture: () => calls.push("exportPicture"),
    keepPicture: () => calls.push("keepPicture"),
    toggleGeometry: () => calls.push("geometry"),
    geometryOpen: false,
    pictureBusy: { exporting: false, keeping: false },
    openCard: (x) => calls.push(`card ${x.type}:${x.id}`),
    // the card panel is marked by a target whose name is "card" in these tests
    returnFocus: (from) => (from as { name?: string } | null)?.name === "card" && !!calls.push("back"),
    openJoin: () => calls.push("join"),
    toggleList: () => calls.push("list"),
    listOpen: false,
  };
  return { store, ctx, calls, sheet: () => sheet };
}

describe("the command list", () => {
  it("gives every command an id, a label and something to do; keys come with a key test", () => {
    expect(new Set(COMMANDS.map((c) => c.id)).size).toBe(COMMANDS.length);
    for (const c of COMMANDS) {
      expect(c.label.length).toBeGreaterThan(3);
      expect(typeof c.perform).toBe("function");
      expect(!!c.keys).toBe(!!c.match);
      expect(!!c.keys || !!c.button).toBe(true); // reachable from the keyboard or the toolbar
    }
  });

  it("claims each key event for one command at most", () => {
    const events: Key[] = [];
    for (const key of ["a", "c", "d", "e", "f", "g", "i", "j", "k", "l", "p", "r", "s", "v", "y", "z", "?", "/", "[", "]", "Enter", " ", "Escape", "Delete", "Backspace", "ArrowLeft", "ArrowUp"])
      for (const ctrlKey of [false, true]) for (const shiftKey of [false, true]) events.push({ key, ctrlKey, shiftKey });
    for (const k of events) {
      const e = { ctrlKey: false, metaKey: false, shiftKey: false, ...k } as KeyboardEvent;
      expect(COMMANDS.filter((c) => c.match?.(e)).map((c) => c.id).length, JSON.stringify(k)).toBeLessThanOrEqual(1);
    }
  });

  it("runs the command a key belongs to", () => {
    const { store, ctx, calls, sheet } = setup();
    const s = () => store.getState();
    expect(press(ctx, { key: "s", ctrlKey: true, target: { tagName: "INPUT" } })).toBe(true); // saves even while typing
    expect(calls).toEqual(["save"]);
    press(ctx, { key: "a", ctrlKey: true });
    expect(s().selection.nodes).toHaveLength(s().nodes.length);
    press(ctx, { key: "Escape" });
    expect(s().selection.nodes).toHaveLength(0);
    press(ctx, { key: "]" });
    expect(s().selection.nodes).toEqual([s().nodes[0].id]);
    const before = s().nodes[0].position;
    expect(press(ctx, { key: "ArrowRight", shiftKey: true })).toBe(true);
    expect(s().nodes[0].position).toEqual({ x: before.x + 5 * GRID, y: before.y });
    expect(press(ctx, { key: "z", metaKey: true })).toBe(true);
    expect(s().nodes[0].position).toEqual(before);
    press(ctx, { key: "z", ctrlKey: true, shiftKey: true });
    expect(s().nodes[0].position.x).toBe(before.x + 5 * GRID);
    const count = s().nodes.length;
    press(ctx, { key: "d", ctrlKey: true });
    expect(s().nodes).toHaveLength(count + 1);
    press(ctx, { key: "Delete" });
    expect(s().nodes).toHaveLength(count);
    press(ctx, { key: "f" });
    expect(calls).toEqual(["save", "fit"]);
    press(ctx, { key: "?" });
    expect(sheet()).toBe(true);
    press(ctx, { key: "Escape" }); // closes the sheet first
    expect(sheet()).toBe(false);
    // Typing in a field keeps its keys.
    press(ctx, { key: "a", ctrlKey: true, target: { tagName: "TEXTAREA" } });
    expect(s().selection.nodes.length).toBeLessThan(s().nodes.length);
  });

  it("gives every toolbar command a key, so the sheet lists it and the keyboard reaches it", () => {
    for (const c of COMMANDS.filter((x) => x.button)) expect(c.keys, c.id).toBeTruthy();
  });

  it("opens the card of the part or joint in focus on the canvas with Enter or Space, and Escape comes back", () => {
    const { store, ctx, calls } = setup();
    // React Flow's wrappers carry data-id; a fake element answers closest() as the DOM would.
    const onCanvas = (cls: string, id: string) => ({ tagName: "DIV", closest: (sel: string) => (sel === cls ? { getAttribute: () => id } : null) });
    expect(press(ctx, { key: "Enter", target: onCanvas(".react-flow__node", "horn") })).toBe(true);
    expect(press(ctx, { key: " ", target: onCanvas(".react-flow__edge", "j-aft-horn") })).toBe(true);
    expect(calls).toEqual(["card node:horn", "card joint:j-aft-horn"]);
    // Enter anywhere else is the browser's (a button, a link).
    expect(press(ctx, { key: "Enter", target: { tagName: "BUTTON", closest: () => null } })).toBe(false);
    store.getState().select({ type: "node", id: "horn" });
    press(ctx, { key: "Escape", target: { tagName: "INPUT", name: "card" } }); // from a field of the card
    expect(calls.at(-1)).toBe("back");
    expect(store.getState().selection.nodes).toEqual(["horn"]); // the part stays selected
    press(ctx, { key: "Escape", target: { tagName: "INPUT", name: "elsewhere" } }); // typing elsewhere: nothing
    expect(store.getState().selection.nodes).toEqual(["horn"]);
    press(ctx, { key: "Escape" });
    expect(store.getState().selection.nodes).toEqual([]);
  });

  it("moves a part one grid step per arrow press, each press its own undo step", () => {
    const { store, ctx } = setup();
    const s = () => store.getState();
    s().select({ type: "node", id: s().nodes[0].id });
    const p0 = s().nodes[0].position;
    press(ctx, { key: "ArrowRight" });
    press(ctx, { key: "ArrowDown" });
    expect(s().nodes[0].position).toEqual({ x: p0.x + GRID, y: p0.y + GRID });
    press(ctx, { key: "z", ctrlKey: true });
    expect(s().nodes[0].position).toEqual({ x: p0.x + GRID, y: p0.y });
    press(ctx, { key: "z", ctrlKey: true });
    expect(s().nodes[0].position).toEqual(p0);
  });

  it("opens the keyboard join for one selected part only, and switches to the list with L", () => {
    const { store, ctx, calls } = setup();
    press(ctx, { key: "j" });
    expect(calls).toEqual([]);
    expect(store.getState().notice?.text).toMatch(/Select one part/);
    store.getState().select({ type: "node", id: "horn" });
    press(ctx, { key: "j" });
    press(ctx, { key: "l" });
    press(ctx, { key: "j", ctrlKey: true }); // not with a modifier
    expect(calls).toEqual(["join", "list"]);
  });

  it("leaves the linkage alone for someone who may not edit, but lets them select and look", () => {
    const { store, ctx } = setup(false);
    const s = () => store.getState();
    const nodes = s().nodes;
    press(ctx, { key: "a", ctrlKey: true });
    expect(s().selection.nodes).toHaveLength(nodes.length);
    press(ctx, { key: "Delete" });
    press(ctx, { key: "ArrowDown" });
    press(ctx, { key: "d", ctrlKey: true });
    press(ctx, { key: "v", ctrlKey: true });
    expect(s().nodes).toBe(nodes);
  });
});
