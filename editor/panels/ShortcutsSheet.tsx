"use client";
/**
 * The keyboard sheet ("?"): the mouse gestures and where Tab goes, then every command that has keys (editor/commands.ts).
 * It fits the screen at any size: its title and Close stay at the top, the list scrolls inside the sheet, and
 * the page behind does not scroll while it is open.
 */
import { trapTab } from "./focus-trap";
import { useEffect, useRef } from "react";
import { COMMANDS, GESTURES } from "../commands";

/** Keeps the page behind a modal sheet still (the wheel and touch scroll the sheet's list, never the page). */
function useLockPageScroll() {
  useEffect(() => {
    const els = [document.documentElement, document.body];
    const was = els.map((el) => el.style.overflow);
    for (const el of els) el.style.overflow = "hidden";
    return () => els.forEach((el, i) => { el.style.overflow = was[i]; });
  }, []);
}

export function ShortcutsSheet({ onClose, readOnly }: { onClose: () => void; readOnly: boolean }) {
  const ref = useRef<HTMLButtonElement>(null);
  const dialog = useRef<HTMLDivElement>(null);
  useLockPageScroll();
  // Opened from the "Keys ?" button or a key: the element that had the focus, read before the sheet takes it.
  const opener = useRef<HTMLElement | null | undefined>(undefined);
  if (opener.current === undefined && typeof document !== "undefined") opener.current = document.activeElement as HTMLElement | null;
  useEffect(() => {
    const sheet = dialog.current;
    ref.current?.focus({ preventScroll: true });
    return () => {
      // Closed, the focus goes back where it was (else to that button) — unless the sheet is still there
      // (React's development re-run of effects unmounts and mounts it again at once).
      const was = opener.current;
      requestAnimationFrame(() => {
        if (sheet?.isConnected) return;
        const back = was && was !== document.body && was.isConnected ? was : document.querySelector<HTMLElement>("[data-testid=btn-shortcuts]");
        back?.focus();
      });
    };
  }, []);
  /** A modal dialog: Tab and Shift+Tab go round its own controls. */
  const trap = (e: React.KeyboardEvent) => trapTab(e, dialog.current);
  const rows = [...GESTURES, ...COMMANDS.filter((c) => c.keys)].filter((r) => !readOnly || !r.edit);
  return (
    <div className="fixed inset-0 z-40 flex items-center justify-center overscroll-contain bg-ink/30 p-3 sm:p-4" onClick={onClose} role="presentation">
      <div
        ref={dialog}
        onKeyDown={trap}
        role="dialog"
        aria-modal="true"
        aria-labelledby="keys-title"
        data-testid="shortcuts-sheet"
        className="flex max-h-full w-full max-w-md flex-col overflow-hidden rounded-lg bg-white text-ink shadow-xl"
        onClick={(e) => e.stopPropagation()}
      >
        <div className="flex shrink-0 items-center justify-between border-b border-ink/10 px-4 py-2">
          <h2 id="keys-title" className="text-base font-semibold">
            Keys
          </h2>
          <button ref={ref} type="button" onClick={onClose} data-testid="shortcuts-close" className="min-h-8 rounded px-2 py-0.5 text-[12px] hover:bg-paper">
            Close
          </button>
        </div>
        {/* The list scrolls here (focusable, so the arrow keys and Page Down scroll it too). */}
        <div className="min-h-0 flex-1 overflow-y-auto overscroll-contain px-4 pb-3 pt-1" tabIndex={0} aria-label="Keys and gestures" data-testid="shortcuts-list">
          <table className="w-full text-[12px]">
            <tbody>
              {rows.map((r) => (
                <tr key={r.keys} className="border-t border-ink/5 first:border-t-0">
                  <td className="py-1 pr-3 align-top font-mono text-[11px] whitespace-nowrap">{r.keys}</td>
                  <td className="py-1 text-ink-soft">{r.label}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {readOnly && <p className="mt-2 text-[11px] text-ink-soft">You can select and inspect; editing keys are off for your role.</p>}
        </div>
      </div>
    </div>
  );
}
