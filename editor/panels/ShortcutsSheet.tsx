"use client";
/** The keyboard sheet ("?"): the mouse gestures and where Tab goes, then every command that has keys (editor/commands.ts). */
import { useEffect, useRef } from "react";
import { COMMANDS, GESTURES } from "../commands";

export function ShortcutsSheet({ onClose, readOnly }: { onClose: () => void; readOnly: boolean }) {
  const ref = useRef<HTMLButtonElement>(null);
  const dialog = useRef<HTMLDivElement>(null);
  useEffect(() => {
    // Opened from the "Keys ?" button or a key: closed, the focus goes back where it was (else to that button).
    const opener = document.activeElement as HTMLElement | null;
    ref.current?.focus();
    return () => {
      const back = opener && opener !== document.body && opener.isConnected ? opener : document.querySelector<HTMLElement>("[data-testid=btn-shortcuts]");
      requestAnimationFrame(() => back?.focus());
    };
  }, []);
  /** A modal dialog: Tab and Shift+Tab go round its own controls. */
  const trap = (e: React.KeyboardEvent) => {
    if (e.key !== "Tab" || !dialog.current) return;
    const stops = Array.from(dialog.current.querySelectorAll<HTMLElement>("button, [href], input, select, textarea, [tabindex]:not([tabindex='-1'])")).filter((el) => !el.hasAttribute("disabled"));
    if (stops.length === 0) return;
    const first = stops[0], last = stops[stops.length - 1];
    const at = document.activeElement;
    if (e.shiftKey ? at === first || !dialog.current.contains(at) : at === last || !dialog.current.contains(at)) {
      e.preventDefault();
      (e.shiftKey ? last : first).focus();
    }
  };
  const rows = [...GESTURES, ...COMMANDS.filter((c) => c.keys)].filter((r) => !readOnly || !r.edit);
  return (
    <div className="fixed inset-0 z-40 flex items-center justify-center bg-ink/30 p-4" onClick={onClose} role="presentation">
      <div ref={dialog} onKeyDown={trap} role="dialog" aria-modal="true" aria-labelledby="keys-title" data-testid="shortcuts-sheet" className="w-full max-w-md rounded-lg bg-white p-4 text-ink shadow-xl" onClick={(e) => e.stopPropagation()}>
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
            {rows.map((r) => (
              <tr key={r.keys} className="border-t border-ink/5">
                <td className="py-1 pr-3 font-mono text-[11px] whitespace-nowrap">{r.keys}</td>
                <td className="py-1 text-ink-soft">{r.label}</td>
              </tr>
            ))}
          </tbody>
        </table>
        {readOnly && <p className="mt-2 text-[11px] text-ink-soft">You can select and inspect; editing keys are off for your role.</p>}
      </div>
    </div>
  );
}
