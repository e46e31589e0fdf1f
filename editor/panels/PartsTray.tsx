"use client";
/** The parts tray: drag a kind onto the canvas, or press its button to place it in view (keyboard friendly). */
import { useReactFlow } from "@xyflow/react";
import { KIND_LIST, type NodeKind } from "@/shared/linkage/kinds";
import { useEditorConfig, useEditorStoreApi } from "../context";
import { KindGlyph } from "../nodes/glyphs";
import { dropCorner, KIND_MIME } from "../canvas/viewport";

export default function PartsTray() {
  const api = useEditorStoreApi();
  const { readOnly } = useEditorConfig();
  const rf = useReactFlow();

  const placeInView = (kind: NodeKind) => {
    const el = document.querySelector<HTMLElement>("[data-testid=canvas]");
    const r = el?.getBoundingClientRect();
    const centre = r ? rf.screenToFlowPosition({ x: r.left + r.width / 2, y: r.top + r.height / 2 }) : { x: 0, y: 0 };
    // Step each new part down a little so repeated clicks do not stack exactly.
    const n = api.getState().nodes.length % 8;
    api.getState().addNode(kind, dropCorner(kind, { x: centre.x + n * 20, y: centre.y + n * 20 }));
  };

  return (
    <aside className="flex w-48 shrink-0 flex-col border-r border-ink/10 bg-paper" aria-label="Parts tray" data-testid="parts-tray">
      <div className="border-b border-ink/10 px-3 py-2 text-[11px] font-semibold uppercase tracking-wider text-ink-soft">Parts</div>
      {readOnly ? (
        <p className="px-3 py-2 text-xs text-ink-soft">You can inspect this linkage; editing is for the build&apos;s owner and builders.</p>
      ) : (
        <ul className="flex-1 overflow-y-auto py-1">
          {KIND_LIST.map(({ kind, name, hint }) => (
            <li key={kind}>
              <button
                type="button"
                draggable
                data-testid={`tray-${kind}`}
                onDragStart={(e) => {
                  e.dataTransfer.setData(KIND_MIME, kind);
                  e.dataTransfer.effectAllowed = "copy";
                }}
                onClick={() => placeInView(kind)}
                className="group flex w-full cursor-grab items-start gap-2 px-3 py-1.5 text-left hover:bg-white focus:bg-white focus:outline-none focus-visible:ring-2 focus-visible:ring-inset focus-visible:ring-ink active:cursor-grabbing"
                title={`Drag onto the canvas, or press to place a ${name.toLowerCase()} in view`}
              >
                <KindGlyph kind={kind} className="mt-0.5 h-4 w-4 shrink-0 text-ink" />
                <span className="min-w-0">
                  <span className="block text-[12px] font-medium leading-4 text-ink">{name}</span>
                  <span className="block text-[10px] leading-3 text-ink-soft">{hint}</span>
                </span>
              </button>
            </li>
          ))}
        </ul>
      )}
      <div className="border-t border-ink/10 px-3 py-2 text-[10px] leading-4 text-ink-soft">
        Drag from a port to another port to make a joint. Press <kbd className="rounded border border-ink/20 bg-white px-1">?</kbd> for keys.
      </div>
    </aside>
  );
}
