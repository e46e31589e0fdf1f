/**
 * The editor's toolbar for the builder and for a reader (reviewer, viewer): a reader is not shown the editing
 * tools at all (a row of greyed-out buttons only crowds a phone), and keeps the picture export and the help.
 * Rendered to static markup (the pure project has no DOM).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { createEditorStore } from "@/editor/store";
import { loadSchema } from "@/editor/store/schema";
import { Toolbar } from "@/editor/toolbar/Toolbar";
import type { CommandCtx } from "@/editor/commands";
import { emptyGraph } from "@/shared/linkage/schema";

beforeAll(() => loadSchema());

function toolbar(canEdit: boolean, buildId?: string, listOpen = false) {
  const noop = () => {};
  const ctx: CommandCtx = {
    store: createEditorStore(emptyGraph("Pitch", "pitch"), { now: () => 0 }), canEdit,
    fitAll: noop, saveNow: noop, toggleSheet: noop, sheetOpen: () => false, closeSheet: noop, openImport: noop, exportFile: noop,
    exportPicture: noop, keepPicture: noop, toggleGeometry: noop, geometryOpen: false, pictureBusy: { exporting: false, keeping: false },
    openCard: noop, returnFocus: () => false, openJoin: noop, toggleList: noop, listOpen,
  };
  return renderToStaticMarkup(createElement(Toolbar, {
    ctx, title: { linkageName: "Pitch", system: "pitch", buildName: "Build", buildId, revision: 1 },
    save: { status: canEdit ? "saved" : "readonly", error: null }, picture: { state: "idle" as never, dismiss: noop },
    importInput: { ref: { current: null }, onChange: noop },
  }));
}

describe("the toolbar", () => {
  it("shows a builder the editing tools", () => {
    const html = toolbar(true);
    for (const id of ["btn-undo", "btn-redo", "btn-join", "btn-export-png"]) expect(html).toContain(`data-testid="${id}"`);
  });
  it("shows a reader none of them, and still the picture export", () => {
    const html = toolbar(false);
    for (const id of ["btn-undo", "btn-redo", "btn-join", "btn-keep-picture"]) expect(html).not.toContain(`data-testid="${id}"`);
    expect(html).toContain(`data-testid="btn-export-png"`);
  });
  it("offers Fit with the diagram, not in the list view where there is nothing to fit", () => {
    expect(toolbar(true)).toContain(`data-testid="btn-fit"`);
    expect(toolbar(true, undefined, true)).not.toContain(`data-testid="btn-fit"`);
  });
  it("links the build's name back to the build, for everyone who may open it", () => {
    for (const canEdit of [true, false]) {
      const html = toolbar(canEdit, "e60bc583-c849-4a18-ac27-8b551fea47bb");
      expect(html).toMatch(/<a href="\/builds\/e60bc583-c849-4a18-ac27-8b551fea47bb" data-testid="editor-build-link"[^>]*focus-visible:outline[^>]*>Build<\/a>/);
    }
    expect(toolbar(true)).not.toContain("editor-build-link"); // no build to go back to: plain text
  });
});
