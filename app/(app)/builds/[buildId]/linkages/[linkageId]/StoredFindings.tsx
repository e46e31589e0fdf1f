"use client";
/**
 * What the editor shows before its script has loaded: the findings stored with the revision (computed by the
 * server when it was saved), rendered on the server, so a person sees them at once; the live editor replaces
 * this as soon as it is ready. Worst first; a long list names its first 50 and counts the rest.
 */
import { createContext, useContext } from "react";
import type { Finding, Severity } from "@/shared/analysis/types";
import { CAUTION_TEXT } from "@/shared/caution";

export type Stored = { revision: number; findings: Finding[] | null };
export const StoredFindingsContext = createContext<Stored | null>(null);

const ORDER: Severity[] = ["hazard", "caution", "advisory"];
const WORD: Record<Severity, string> = { hazard: "Hazard", caution: "Caution", advisory: "Advisory" };
const TONE: Record<Severity, string> = { hazard: "text-hazard", caution: "text-caution", advisory: "text-advisory" };
const SHOWN = 50;

export function StoredFindings() {
  const s = useContext(StoredFindingsContext);
  const all = s?.findings ? [...s.findings].sort((a, b) => ORDER.indexOf(a.severity) - ORDER.indexOf(b.severity)) : null;
  return (
    <div className="flex h-[calc(100vh-3.5rem)] min-h-0" data-testid="editor-opening">
      <div className="flex flex-1 items-center justify-center text-ink-soft" role="status">Opening the linkage…</div>
      <aside className="flex w-80 max-w-full shrink-0 flex-col border-l border-ink/10 bg-white" aria-label="Findings stored with this revision">
        <div data-testid="findings" className="min-h-0 flex-1 overflow-y-auto p-3 text-[12px]">
          <p className="mb-2 text-[11px] font-semibold uppercase tracking-wide text-ink-soft">
            Findings{s ? ` of revision ${s.revision}` : ""} <span className="font-normal normal-case">(as saved; the live check takes over in a moment)</span>
          </p>
          {all === null ? (
            <p className="text-ink-soft">This revision was saved without a stored check; the live check runs when the editor opens.</p>
          ) : all.length === 0 ? (
            <p className="text-ink-soft">No findings were stored with this revision.</p>
          ) : (
            <ul className="space-y-1">
              {all.slice(0, SHOWN).map((f, i) => (
                <li key={i} data-testid="finding" data-code={f.code} data-severity={f.severity} data-subject={`${f.subject.type}:${f.subject.id}`} className="rounded border border-ink/10 px-1.5 py-1">
                  <span className={`font-semibold ${TONE[f.severity]}`}>{WORD[f.severity]}: </span>{f.message}
                </li>
              ))}
              {all.length > SHOWN ? <li className="text-ink-soft">…and {all.length - SHOWN} more, listed when the editor opens.</li> : null}
            </ul>
          )}
        </div>
        <p className="border-t border-ink/10 p-3 text-[10px] leading-4 text-ink-soft">{CAUTION_TEXT}</p>
      </aside>
    </div>
  );
}
