"use client";
/** The linkage's review panel: sign-off state and form, what still blocks it, revision history and diff, e-mail setting. */
import { findingTitle } from "@/shared/analysis/finding-title";
import { useState } from "react";
import { ApiFailure } from "@/components/api-client";
import { NOTIFY_LABEL, NOTIFY_PREFS, NOTIFY_SHORT, type NotifyPref } from "@/shared/notify";
import dynamic from "next/dynamic";
import { useAcknowledgements, useDiff, useNotify, useReviewActions, useSignoffs } from "./api";
import type { ReviewMe } from "./ReviewThread";
import { SignoffBadge } from "./SignoffBadge";
import { heading, when } from "./format";

// The history and the field-by-field comparison are read when asked for (or when a sign-off is out of date), so they
// are loaded then, not with every page that shows the review panel.
/** The record PDF's button loads with the first signed revision shown (a linkage not signed off yet has none). */
const ExportButton = dynamic(() => import("@/components/records/ExportButton").then((m) => m.ExportButton), { ssr: false, loading: () => <span className="text-[11px] text-ink-soft">Record PDF…</span> });
const RevisionHistory = dynamic(() => import("./RevisionHistory").then((m) => m.RevisionHistory), { ssr: false, loading: () => <p className="text-[11px] text-ink-soft">Loading the history…</p> });
const DiffView = dynamic(() => import("./DiffView").then((m) => m.DiffView), { ssr: false, loading: () => <p className="text-[11px] text-ink-soft">Comparing the revisions…</p> });

const box = "w-full rounded border border-ink/20 bg-white px-2 py-1 text-[12px] text-ink focus:border-advisory focus:outline-none";

type Hazard = { code: string; subject: { type: string; id: string }; subjectName: string; message: string; lapsed: boolean };

function SignoffSection({ buildId, linkageId, me }: { buildId: string; linkageId: string; me: ReviewMe }) {
  const s = useSignoffs(buildId, linkageId);
  const acks = useAcknowledgements(buildId, linkageId);
  const actions = useReviewActions(buildId, linkageId);
  const [statement, setStatement] = useState("");
  const [refused, setRefused] = useState<{ message: string; hazards: Hazard[] } | null>(null);
  const current = s.data?.currentRevision;
  const blocking = (acks.data?.findings ?? []).filter((f) => f.severity === "hazard" && !f.acknowledgement);
  return (
    <div className="space-y-1.5" data-testid="signoff-section">
      <p className={heading}>Sign-off</p>
      {s.data && <SignoffBadge status={s.data.status} currentRevision={s.data.currentRevision} />}
      {s.data && s.data.signoffs.length > 0 && (
        <ul className="space-y-1 text-[11px]" data-testid="signoff-list">
          {s.data.signoffs.slice(0, 5).map((x) => (
            <li key={x.id} data-testid="signoff-item" data-stale={x.stale ? "yes" : "no"} className={x.stale ? "text-ink-soft line-through decoration-ink/30" : ""}>
              r{x.revision} · {x.reviewer.name} · {when(x.createdAt)}
              <span className="block whitespace-pre-wrap no-underline" style={{ textDecoration: "none" }}>&ldquo;{x.statement}&rdquo;</span>
              {x.fingerprint && (
                <span className="mt-0.5 block no-underline" style={{ textDecoration: "none" }}>
                  <ExportButton buildId={buildId} kind="revision-record" params={{ linkageId, revision: x.revision }} testId={`record-pdf-${x.revision}`}>
                    Record PDF of r{x.revision}
                  </ExportButton>
                </span>
              )}
            </li>
          ))}
          {s.data.signoffs.length > 5 ? (
            <li className="text-ink-soft" data-testid="signoff-more">…and {s.data.signoffs.length - 5} earlier sign-off{s.data.signoffs.length - 5 === 1 ? "" : "s"}, in the revision history.</li>
          ) : null}
          <li><a href="/verify" className="text-advisory underline" target="_blank" rel="noreferrer">Check a record PDF against the signed revisions</a></li>
        </ul>
      )}
      {blocking.length > 0 && (
        <div className="rounded border border-hazard/30 bg-hazard/5 p-1.5 text-[11px]" data-testid="signoff-blockers">
          <p className="font-semibold text-hazard">{blocking.length} hazard{blocking.length === 1 ? "" : "s"} without an acknowledgement:</p>
          <ul className="list-disc pl-4">
            {blocking.map((f, i) => (
              <li key={i}>
                <span data-code={f.code}>{findingTitle(f.code)}</span> at {f.subjectName}
                {f.lapsed ? " (acknowledgement lapsed)" : ""}
              </li>
            ))}
          </ul>
          <p className="mt-0.5 text-ink-soft">Select the part or joint to acknowledge a finding with a reason, or fix the hardware.</p>
        </div>
      )}
      {me.canSignOff && current !== undefined && (
        <form
          className="space-y-1"
          onSubmit={async (e) => {
            e.preventDefault();
            setRefused(null);
            try {
              await actions.signOff.mutateAsync({ revision: current, statement });
              setStatement("");
            } catch (err) {
              if (err instanceof ApiFailure && err.code === "unacknowledged_hazards") {
                const body = err.body as { error: { hazards: Hazard[] } };
                setRefused({ message: err.message, hazards: body.error.hazards });
              } else setRefused({ message: err instanceof Error ? err.message : String(err), hazards: [] });
            }
          }}
        >
          <label htmlFor="signoff-statement" className="block text-[11px] text-ink-soft">
            Statement for revision {current}
          </label>
          <textarea id="signoff-statement" data-testid="signoff-statement" className={box} rows={2} value={statement} onChange={(e) => setStatement(e.target.value)} placeholder="What you inspected and on what basis" />
          {refused && (
            <div role="alert" data-testid="signoff-refused" className="text-[11px] text-hazard">
              {refused.message}
              {refused.hazards.length > 0 && (
                <ul className="list-disc pl-4">
                  {refused.hazards.map((h, i) => (
                    <li key={i} data-code={h.code}>{findingTitle(h.code)} at {h.subjectName}: {h.message}</li>
                  ))}
                </ul>
              )}
            </div>
          )}
          <button type="submit" data-testid="signoff-submit" disabled={!statement.trim() || actions.signOff.isPending} className="min-h-6 rounded bg-ok px-2 py-0.5 text-[11px] font-medium text-white disabled:opacity-50">
            Sign off revision {current}
          </button>
        </form>
      )}
    </div>
  );
}

function HistorySection({ buildId, linkageId }: { buildId: string; linkageId: string }) {
  const [open, setOpen] = useState(false);
  return (
    <div className="space-y-1" data-testid="history-section">
      <button type="button" data-testid="history-toggle" className={`touch-target inline-flex min-h-6 items-center ${heading} hover:text-ink`} onClick={() => setOpen((v) => !v)} aria-expanded={open}>
        {open ? "▾" : "▸"} Revision history
      </button>
      {open && <RevisionHistory buildId={buildId} linkageId={linkageId} />}
    </div>
  );
}

/** What a reviewer looks at first when the linkage changed after its last sign-off: the changes since, field by field. */
function SinceSignoff({ buildId, linkageId }: { buildId: string; linkageId: string }) {
  const s = useSignoffs(buildId, linkageId);
  const latest = s.data?.status.latest ?? null;
  const current = s.data?.currentRevision ?? null;
  const stale = !!latest && current !== null && latest.revision < current;
  const diff = useDiff(buildId, linkageId, stale ? latest!.revision : null, stale ? current : null);
  if (!stale) return null;
  return (
    <div className="space-y-1 rounded border border-caution/30 bg-caution/5 p-1.5 text-[11px]" data-testid="since-signoff">
      <p className={heading}>Changed since the last sign-off</p>
      <p>Revision {latest!.revision} was signed off by {latest!.reviewer.name}; the linkage is now at revision {current}. What changed:</p>
      {diff.data ? <DiffView d={diff.data.diff} /> : <p className="text-ink-soft">Comparing the revisions…</p>}
    </div>
  );
}

function NotifySetting() {
  const q = useNotify();
  const { setNotify } = useReviewActions("", "");
  if (!q.data) return null;
  return (
    <div className="space-y-0.5">
      <label htmlFor="notify-pref" className={heading}>Review e-mail to me</label>
      {/* Short options, so the chosen one shows whole; the full sentence of the choice is the line under it. */}
      <select id="notify-pref" data-testid="notify-select" className={box} value={q.data.notify} aria-describedby="notify-pref-help" onChange={(e) => setNotify.mutate(e.target.value as NotifyPref)}>
        {NOTIFY_PREFS.map((p) => <option key={p} value={p}>{NOTIFY_SHORT[p]}</option>)}
      </select>
      <p id="notify-pref-help" className="text-[11px] text-ink-soft">{NOTIFY_LABEL[q.data.notify]}.</p>
    </div>
  );
}

export function ReviewPanel({ buildId, linkageId, me, unresolved, names }: { buildId: string; linkageId: string; me: ReviewMe; unresolved: Record<string, number>; names: Record<string, string> }) {
  const openSubjects = Object.entries(unresolved).filter(([k]) => !k.startsWith("linkage:"));
  return (
    <div className="space-y-3 rounded border border-ink/10 bg-white p-2" data-testid="review-panel">
      <SinceSignoff buildId={buildId} linkageId={linkageId} />
      <SignoffSection buildId={buildId} linkageId={linkageId} me={me} />
      {openSubjects.length > 0 && (
        <div className="text-[11px]" data-testid="open-threads">
          <p className={heading}>Open threads</p>
          <ul>
            {openSubjects.map(([k, n]) => (
              <li key={k} data-subject={k}>
                {names[k] ?? "a part or joint no longer in the drawing"} — {n} open
              </li>
            ))}
          </ul>
        </div>
      )}
      <HistorySection buildId={buildId} linkageId={linkageId} />
      <NotifySetting />
    </div>
  );
}
