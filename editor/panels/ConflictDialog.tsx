"use client";
/** Shown when a save finds that someone else saved a newer revision first. */
import { useEffect, useRef } from "react";
import type { Difference, RemoteRevision } from "../useAutosave";

function Line({ label, names }: { label: string; names: string[] }) {
  if (names.length === 0) return null;
  const shown = names.slice(0, 4).join(", ") + (names.length > 4 ? ` and ${names.length - 4} more` : "");
  return (
    <li>
      <b className="tabular-nums">{names.length}</b> {names.length === 1 ? label.replace(/^parts/, "part").replace(/^joints/, "joint") : label}: <span className="text-ink-soft">{shown}</span>
    </li>
  );
}

export function ConflictDialog({ current, difference, onLoadTheirs, onKeepMine }: { current: RemoteRevision; difference: Difference; onLoadTheirs: () => void; onKeepMine: () => void }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => ref.current?.querySelector<HTMLButtonElement>("button")?.focus(), []);
  const d = difference;
  const none = [d.parts, d.joints].every((x) => x.onlyMine.length + x.onlyTheirs.length + x.changed.length === 0);
  const when = new Date(current.createdAt);
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-ink/40 p-4" role="presentation">
      <div ref={ref} role="alertdialog" aria-modal="true" aria-labelledby="conflict-title" data-testid="conflict-dialog" className="w-full max-w-lg rounded-lg bg-white p-4 text-ink shadow-xl">
        <h2 id="conflict-title" className="text-base font-semibold">
          A newer revision was saved while you were editing
        </h2>
        <p className="mt-1 text-[13px] text-ink-soft" data-testid="conflict-author">
          Revision {current.revision} by <b className="text-ink">{current.author.name}</b>, {Number.isNaN(when.getTime()) ? current.createdAt : when.toLocaleString()}.
        </p>
        <div className="mt-3 rounded border border-ink/10 bg-paper p-2 text-[12px]" data-testid="conflict-diff">
          <p className="mb-1 font-semibold">Their revision compared with your work</p>
          {none ? (
            <p className="text-ink-soft">The parts and joints are the same; only positions or metadata differ.</p>
          ) : (
            <ul className="space-y-0.5">
              <Line label="parts only in theirs" names={d.parts.onlyTheirs} />
              <Line label="parts only in yours" names={d.parts.onlyMine} />
              <Line label="parts changed" names={d.parts.changed} />
              <Line label="joints only in theirs" names={d.joints.onlyTheirs} />
              <Line label="joints only in yours" names={d.joints.onlyMine} />
              <Line label="joints changed" names={d.joints.changed} />
            </ul>
          )}
        </div>
        <p className="mt-3 text-[12px] text-ink-soft">
          Loading theirs drops your unsaved edits. Keeping yours saves your linkage as a new revision on top of theirs (their revision stays in the history).
        </p>
        <div className="mt-3 flex justify-end gap-2">
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
