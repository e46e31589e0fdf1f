"use client";
/** The keyboard sheet ("?"). */
import { useEffect, useRef } from "react";

const KEYS: [string, string, boolean][] = [
  ["Drag port → port", "make a joint", true],
  ["Click / Shift-drag", "select / box-select", false],
  ["Ctrl/⌘ + click", "add to the selection", false],
  ["Ctrl/⌘ A", "select everything", false],
  ["[  ]", "previous / next part", false],
  ["Esc", "clear the selection", false],
  ["Arrows (Shift ×5)", "nudge the selected parts", true],
  ["Delete / Backspace", "delete the selection", true],
  ["Ctrl/⌘ D", "duplicate", true],
  ["Ctrl/⌘ C / V", "copy / paste", true],
  ["Ctrl/⌘ Z", "undo", true],
  ["Ctrl/⌘ Shift Z, Ctrl/⌘ Y", "redo", true],
  ["Ctrl/⌘ S", "save now", true],
  ["F", "fit the linkage in view", false],
  ["?", "this sheet", false],
];

export function ShortcutsSheet({ onClose, readOnly }: { onClose: () => void; readOnly: boolean }) {
  const ref = useRef<HTMLButtonElement>(null);
  useEffect(() => ref.current?.focus(), []);
  return (
    <div className="fixed inset-0 z-40 flex items-center justify-center bg-ink/30 p-4" onClick={onClose} role="presentation">
      <div role="dialog" aria-modal="true" aria-labelledby="keys-title" data-testid="shortcuts-sheet" className="w-full max-w-md rounded-lg bg-white p-4 text-ink shadow-xl" onClick={(e) => e.stopPropagation()}>
        <div className="mb-2 flex items-center justify-between">
          <h2 id="keys-title" className="text-base font-semibold">
            Keys
          </h2>
          <button ref={ref} type="button" onClick={onClose} className="rounded px-2 py-0.5 text-[12px] hover:bg-paper">
            Close
          </button>
        </div>
        <table className="w-full text-[12px]">
          <tbody>
            {KEYS.filter(([, , edit]) => !readOnly || !edit).map(([k, what]) => (
              <tr key={k} className="border-t border-ink/5">
                <td className="py-1 pr-3 font-mono text-[11px] whitespace-nowrap">{k}</td>
                <td className="py-1 text-ink-soft">{what}</td>
              </tr>
            ))}
          </tbody>
        </table>
        {readOnly && <p className="mt-2 text-[11px] text-ink-soft">You can select and inspect; editing keys are off for your role.</p>}
      </div>
    </div>
  );
}
