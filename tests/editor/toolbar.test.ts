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
import { COMMANDS, type CommandCtx } from "@/editor/commands";
import { pictureStatusText, PictureStatus } from "@/editor/toolbar/PictureStatus";
import { emptyGraph } from "@/shared/linkage/schema";

beforeAll(() => loadSchema());

function toolbar(canEdit: boolean, buildId?: string, listOpen = false, keeping = false) {
  const noop = () => {};
  const ctx: CommandCtx = {
    store: createEditorStore(emptyGraph("Pitch", "pitch"), { now: () => 0 }), canEdit,
    fitAll: noop, saveNow: noop, toggleSheet: noop, sheetOpen: () => false, closeSheet: noop, openImport: noop, exportFile: noop,
    exportPicture: noop, keepPicture: noop, toggleGeometry: noop, geometryOpen: false, pictureBusy: { exporting: false, keeping },
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

  it("keeps the focus on Keep for the log while the picture is made: aria-disabled, not disabled", () => {
    const tag = (html: string, id: string) => new RegExp(`<button[^>]*data-testid="${id}"[^>]*>`).exec(html)?.[0] ?? "";
    const busy = tag(toolbar(true, undefined, false, true), "btn-keep-picture");
    expect(busy).toContain(`aria-disabled="true"`);
    expect(busy).not.toMatch(/\sdisabled=""/);
    expect(tag(toolbar(true), "btn-keep-picture")).not.toContain(`aria-disabled="`);
    // Other tools still use the plain disabled state (nothing to undo on an empty linkage).
    expect(tag(toolbar(true), "btn-undo")).toMatch(/\sdisabled=""/);
  });
  it("a second press while the picture is made does nothing", () => {
    const keep = COMMANDS.find((c) => c.id === "keepPicture")!;
    let calls = 0;
    const ctx = { pictureBusy: { exporting: false, keeping: true }, keepPicture: () => calls++ } as unknown as CommandCtx;
    keep.perform(ctx);
    expect(calls).toBe(0);
    keep.perform({ ...ctx, pictureBusy: { exporting: false, keeping: false } });
    expect(calls).toBe(1);
  });
});

describe("the picture status chip", () => {
  it("shows a few words (so it stays on the toolbar's row) and speaks the whole sentence", () => {
    const kept = { phase: "kept" as const, revision: 12, url: "/x" };
    expect(pictureStatusText(kept)).toEqual({ short: "Kept with revision 12", full: "Kept with revision 12 for the build log" });
    for (const st of [{ phase: "saving" as const }, { phase: "rendering" as const, revision: 12 }, { phase: "uploading" as const, revision: 12 }, kept])
      expect(pictureStatusText(st).short.length).toBeLessThanOrEqual(24);
    const html = renderToStaticMarkup(createElement(PictureStatus, { state: kept, onDismiss: () => {} }));
    expect(html).toContain(`<span class="sr-only">Kept with revision 12 for the build log</span>`);
    expect(html).toContain("max-w-[13rem]");
  });
});
