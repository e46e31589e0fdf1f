"use client";
/**
 * Shown when a save finds that someone else saved a newer revision first, with what differs (shared/review/diff.ts).
 * Loaded when a conflict first happens (LinkageEditor.tsx), with the difference it shows.
 */
import { trapTab } from "./focus-trap";
import { useEffect, useMemo, useRef } from "react";
import { diffGraphs, type ItemRef } from "@/shared/review/diff";
import { useEditorStoreApi } from "../context";
import type { RemoteRevision } from "../useAutosave";

function Line({ label, items }: { label: string; items: ItemRef[] }) {
  if (items.length === 0) return null;
  const names = items.map((x) => x.name);
  const shown = names.slice(0, 4).join(", ") + (names.length > 4 ? ` and ${names.length - 4} more` : "");
  return (
    <li>
      <b className="tabular-nums">{names.length}</b> {names.length === 1 ? label.replace(/^parts/, "part").replace(/^joints/, "joint") : label}: <span className="text-ink-soft">{shown}</span>
    </li>
  );
}

/** The controls of a dialog that Tab goes round, in order. */
/**
 * The difference is from your work (as the conflict found it) to their revision: added = only in theirs, removed =
 * only in yours. A modal dialog like the Keys sheet: Tab and Shift+Tab go round its buttons; Escape (or "Decide
 * later") closes it with nothing chosen — saving waits, the toolbar's "Someone else saved" opens it again — and the
 * focus goes back where it was.
 */
export function ConflictDialog({ current, onLoadTheirs, onKeepMine, onLater }: { current: RemoteRevision; onLoadTheirs: () => void; onKeepMine: () => void; onLater: () => void }) {
  const ref = useRef<HTMLDivElement>(null);
  // The element that had the focus when the dialog opened, read before the dialog takes it.
  const opener = useRef<HTMLElement | null | undefined>(undefined);
  if (opener.current === undefined && typeof document !== "undefined") opener.current = document.activeElement as HTMLElement | null;
  useEffect(() => {
    const dialog = ref.current;
    dialog?.querySelector<HTMLButtonElement>("button")?.focus();
    return () => {
      const was = opener.current;
      requestAnimationFrame(() => {
        if (dialog?.isConnected) return; // React's development re-run of effects: still open
        const back = was && was !== document.body && was.isConnected ? was : document.querySelector<HTMLElement>("[data-testid=save-status]");
        back?.focus();
      });
    };
  }, []);
  const onKeyDown = (e: React.KeyboardEvent) => {
    if (e.key === "Escape") {
      e.preventDefault();
      e.stopPropagation();
      onLater();
      return;
    }
    trapTab(e, ref.current);
  };
  const store = useEditorStoreApi();
  const d = useMemo(() => {
    const s = store.getState();
    // Mine → theirs: "added" is only in theirs, "removed" only in mine (shared/review/diff.ts, as in the review history).
    return diffGraphs({ nodes: s.nodes, joints: s.joints }, { nodes: current.graph.nodes, joints: current.graph.joints });
  }, [current, store]);
  const when = new Date(current.createdAt);
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-ink/40 p-4" role="presentation">
      <div ref={ref} onKeyDown={onKeyDown} role="alertdialog" aria-modal="true" aria-labelledby="conflict-title" data-testid="conflict-dialog" className="w-full max-w-lg rounded-lg bg-white p-4 text-ink shadow-xl">
        <h2 id="conflict-title" className="text-base font-semibold">
          A newer revision was saved while you were editing
        </h2>
        <p className="mt-1 text-[13px] text-ink-soft" data-testid="conflict-author">
          Revision {current.revision} by <b className="text-ink">{current.author.name}</b>, {Number.isNaN(when.getTime()) ? current.createdAt : when.toLocaleString()}.
        </p>
        <div className="mt-3 rounded border border-ink/10 bg-paper p-2 text-[12px]" data-testid="conflict-diff">
          <p className="mb-1 font-semibold">Their revision compared with your work</p>
          {d.same ? (
            <p className="text-ink-soft">The parts and joints are the same{d.nodes.moved ? `; ${d.nodes.moved} part${d.nodes.moved === 1 ? " is" : "s are"} placed differently on the canvas` : ""}.</p>
          ) : (
            <ul className="space-y-0.5">
              {d.linkage.map((f) => (
                <li key={f.path}>
                  Linkage {f.path}: <span className="text-ink-soft">{String(f.after ?? "")}</span>
                </li>
              ))}
              <Line label="parts only in theirs" items={d.nodes.added} />
              <Line label="parts only in yours" items={d.nodes.removed} />
              <Line label="parts changed" items={d.nodes.changed} />
              <Line label="joints only in theirs" items={d.joints.added} />
              <Line label="joints only in yours" items={d.joints.removed} />
              <Line label="joints changed" items={d.joints.changed} />
              {d.nodes.moved > 0 && <li className="text-ink-soft">{d.nodes.moved} part{d.nodes.moved === 1 ? "" : "s"} placed differently on the canvas</li>}
            </ul>
          )}
        </div>
        <p className="mt-3 text-[12px] text-ink-soft">
          Loading theirs drops your unsaved edits. Keeping yours saves your linkage as a new revision on top of theirs (their revision stays in the history).
        </p>
        <div className="mt-3 flex flex-wrap justify-end gap-2">
          <button type="button" onClick={onLater} data-testid="conflict-later" title="Close this and choose later (Escape); nothing is saved until you choose" className="mr-auto rounded px-3 py-1.5 text-[13px] text-ink-soft hover:bg-paper">
            Decide later
          </button>
          <button type="button" onClick={onLoadTheirs} data-testid="conflict-load-theirs" className="rounded border border-ink/20 px-3 py-1.5 text-[13px] font-medium hover:bg-paper">
            Load their revision
          </button>
          <button type="button" onClick={onKeepMine} data-testid="conflict-keep-mine" className="rounded bg-ink px-3 py-1.5 text-[13px] font-medium text-white hover:bg-ink/90">
            Keep mine as a new revision
          </button>
        </div>
      </div>
    </div>
  );
}
