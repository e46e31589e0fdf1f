"use client";
import { useMutation, useQuery } from "@tanstack/react-query";
import { useEffect, useRef, useState } from "react";
import { api } from "@/components/api-client";
import { Button } from "@/components/ui";
import type { ExportJobView, ExportKind } from "@/shared/schemas/exports";

type Estimate = { entries: number; photos: number; estimatedBytes: number; large: boolean };
const mb = (b: number) => (b < 1e6 ? `${Math.max(1, Math.round(b / 1e3))} kB` : `${(b / 1e6).toFixed(b < 1e7 ? 1 : 0)} MB`);

/**
 * Starts an export as a background job and follows it: the estimated size first (when the kind has
 * one), then progress, then a download link — or why it failed, with a retry. The last job of this
 * kind is remembered in the browser, so coming back to the page shows it again; someone who left
 * gets the link by e-mail.
 */
export function ExportButton(p: { buildId: string; kind: ExportKind; params: object; estimateUrl?: string; testId?: string; children: React.ReactNode }) {
  const base = `/api/builds/${p.buildId}/exports`;
  // One remembered job per kind and parameters (a record of revision 3 is not the one of revision 2).
  const memo = `lw-export:${p.buildId}:${p.kind}:${JSON.stringify(p.params)}`;
  const [jobId, setJobId] = useState<string | null>(null);
  const [asking, setAsking] = useState(false);
  const opener = useRef<HTMLButtonElement>(null);
  /** Closes the estimate and gives the focus back to the button that opened it. */
  const closeAsking = () => { setAsking(false); opener.current?.focus(); };
  useEffect(() => setJobId(window.localStorage.getItem(memo)), [memo]);
  const remember = (id: string) => { window.localStorage.setItem(memo, id); setJobId(id); };

  const estimate = useQuery({
    queryKey: ["export-estimate", p.estimateUrl],
    queryFn: () => api<{ estimate: Estimate }>(p.estimateUrl!).then((r) => r.estimate),
    enabled: asking && !!p.estimateUrl,
  });
  const job = useQuery({
    queryKey: ["export", jobId],
    queryFn: () => api<{ job: ExportJobView }>(`${base}/${jobId}`).then((r) => r.job),
    enabled: !!jobId,
    retry: false,
    refetchInterval: (q) => (q.state.data && (q.state.data.status === "done" || q.state.data.status === "failed") ? false : 1000),
  });
  const start = useMutation({
    mutationFn: () => api<{ job: ExportJobView }>(base, { body: { kind: p.kind, params: p.params } }),
    // The panel's own button goes away with the estimate: the focus goes back to the opener, which stays
    // focusable (aria-disabled) while the job runs; the progress below it is a live region.
    onSuccess: (r) => { remember(r.job.id); if (asking) closeAsking(); },
  });
  const retry = useMutation({
    mutationFn: () => api<{ job: ExportJobView }>(`${base}/${jobId}/retry`, { method: "POST" }),
    onSuccess: () => void job.refetch(),
  });
  const j = job.data;
  const busy = j && (j.status === "queued" || j.status === "running");

  return (
    <div className="relative" onKeyDown={(e) => { if (e.key === "Escape" && asking) { e.stopPropagation(); closeAsking(); } }}>
      {/* aria-disabled, not disabled: a disabled button would drop the keyboard's focus to the page. */}
      <Button ref={opener} tone="secondary" data-testid={p.testId} aria-disabled={!!busy || start.isPending} aria-expanded={p.estimateUrl ? asking : undefined}
        className="aria-disabled:cursor-not-allowed aria-disabled:opacity-50"
        onClick={() => { if (busy || start.isPending) return; if (p.estimateUrl) setAsking((a) => !a); else start.mutate(); }}>
        {p.children}
      </Button>
      {asking || j || start.error ? (
        <div className="absolute right-0 z-20 mt-1 w-80 max-w-[90vw] rounded-lg border border-ink/15 bg-white p-3 text-sm shadow-lg" data-testid="export-panel">
          {asking ? (
            estimate.isPending ? <p className="text-ink-soft">Working out the size…</p>
              : estimate.error ? <p role="alert" className="text-hazard">{(estimate.error as Error).message}</p>
              : estimate.data ? (
                <div className="space-y-2">
                  <p data-testid="export-estimate">
                    {estimate.data.entries.toLocaleString("en-US")} entr{estimate.data.entries === 1 ? "y" : "ies"}, {estimate.data.photos.toLocaleString("en-US")} photo{estimate.data.photos === 1 ? "" : "s"}: about <strong>{mb(estimate.data.estimatedBytes)}</strong>.
                  </p>
                  {estimate.data.large ? <p className="text-xs text-caution">A large file: it is made in the background and the link is e-mailed to you as well, so you may leave this page.</p> : null}
                  <div className="flex gap-2">
                    <Button size="sm" onClick={() => { if (!start.isPending) start.mutate(); }} aria-disabled={start.isPending}>{start.isPending ? "Starting…" : "Make the PDF"}</Button>
                    <Button size="sm" tone="ghost" onClick={closeAsking}>Cancel</Button>
                  </div>
                </div>
              ) : null
          ) : null}
          {start.error ? <p role="alert" className="text-hazard">{(start.error as Error).message}</p> : null}
          {!asking && j ? <JobState j={j} onRetry={() => retry.mutate()} retrying={retry.isPending} onClose={() => { window.localStorage.removeItem(memo); setJobId(null); }} /> : null}
        </div>
      ) : null}
    </div>
  );
}

function JobState({ j, onRetry, retrying, onClose }: { j: ExportJobView; onRetry: () => void; retrying: boolean; onClose: () => void }) {
  const pct = Math.round(j.progress * 100);
  return (
    <div className="space-y-2" data-testid="export-job" data-status={j.status}>
      <p className="font-medium">{j.label}</p>
      {j.status === "queued" || j.status === "running" ? (
        <>
          <div role="progressbar" aria-label="Export progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="h-2 overflow-hidden rounded bg-ink/10">
            <div className="h-full bg-advisory transition-all" style={{ width: `${Math.max(3, pct)}%` }} />
          </div>
          <p className="text-xs text-ink-soft" aria-live="polite">{j.status === "queued" ? "Waiting for a worker…" : `${pct}% · ${j.progressNote}`}</p>
        </>
      ) : j.status === "done" ? (
        <p><a className="font-medium text-advisory underline" href={j.downloadUrl!} data-testid="export-download">Download {j.resultName}</a> <span className="text-xs text-ink-soft">({mb(j.resultSize ?? 0)})</span></p>
      ) : (
        <>
          <p role="alert" className="text-xs text-hazard" data-testid="export-error">{j.error}</p>
          <Button size="sm" onClick={onRetry} disabled={retrying}>{retrying ? "Retrying…" : "Retry"}</Button>
        </>
      )}
      {j.status === "done" || j.status === "failed" ? <button type="button" className="text-xs text-ink-soft hover:underline" onClick={onClose}>Close</button> : null}
    </div>
  );
}
