"use client";
import Link from "next/link";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect, useRef, useState } from "react";
import { api, ApiFailure } from "@/components/api-client";
import { Badge, Button, Card, EmptyState, Input, Select } from "@/components/ui";
import { SYSTEMS, type ControlSystem, type LinkageGraph } from "@/shared/linkage/schema";
import { parseLinkageFile } from "@/shared/linkage/io";
import { STARTER_NAME, starterPitchRun } from "@/shared/starter";
import { useRouter } from "next/navigation";

import { linkageKeys } from "@/components/query-keys";
import type { Linkage } from "@/shared/schemas/linkages";
import { checkState, notCheckedWords } from "@/shared/check-state";
import { severityCount } from "@/shared/analysis/finding-title";

export const SYSTEM_LABEL: Record<ControlSystem, string> = { pitch: "Pitch", roll: "Roll", yaw: "Yaw", flap: "Flaps", trim: "Trim", other: "Other" };

/** "rev 3 · 5 Dec 2026, 12:55 · Dana": the linkage's current revision, when, and by whom. */
const lastChange = (l: { revision: number; updatedAt: string; lastAuthor: string | null }) =>
  `rev ${l.revision} · ${new Date(l.updatedAt).toLocaleString("en-CA", { dateStyle: "medium", timeStyle: "short" })}${l.lastAuthor ? ` · ${l.lastAuthor}` : ""}`;

export function LinkagesPanel({ buildId, initial, canEdit }: { buildId: string; initial: Linkage[]; canEdit: boolean }) {
  const qc = useQueryClient();
  const key = linkageKeys.list(buildId);
  const { data: linkages = initial } = useQuery({ queryKey: key, queryFn: async () => (await api<{ linkages: Linkage[] }>(`/api/builds/${buildId}/linkages`)).linkages, initialData: initial });
  const [adding, setAdding] = useState(false);
  const [renaming, setRenaming] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  // Where the focus goes once a form closes: the button that opened it (a CSS selector; it renders again after
  // the form is gone, so it is looked up after that render, and the visible one of a phone/desktop pair is taken).
  const refocus = useRef<string | null>(null);
  useEffect(() => {
    if (!refocus.current) return;
    const el = [...document.querySelectorAll<HTMLElement>(refocus.current)].find((e) => e.offsetParent !== null);
    refocus.current = null;
    el?.focus();
  });
  const closeAdding = () => { refocus.current = '[data-testid="new-linkage"], [data-testid="start-from-nothing"]'; setAdding(false); };
  const closeRenaming = (id: string) => { refocus.current = `[data-rename="${id}"]`; setRenaming(null); };
  const escapeCloses = (close: () => void) => (e: React.KeyboardEvent) => { if (e.key === "Escape") { e.preventDefault(); e.stopPropagation(); close(); } };
  const invalidate = () => qc.invalidateQueries({ queryKey: key });
  const onError = (e: unknown) => setError(e instanceof ApiFailure ? Object.values(e.fields ?? {})[0] ?? e.message : String(e));

  const [importErrors, setImportErrors] = useState<{ file: string; errors: { path: string; message: string }[] } | null>(null);
  async function importFile(file: File) {
    setImportErrors(null);
    const parsed = parseLinkageFile(await file.text());
    if (!parsed.ok) {
      setImportErrors({ file: file.name, errors: parsed.errors });
      return;
    }
    const name = parsed.graph.name.trim() || file.name.replace(/(\.linkage)?\.json$/i, "");
    create.mutate({ name: name.slice(0, 120), system: parsed.graph.system, graph: parsed.graph });
  }

  const create = useMutation({
    mutationFn: (v: { name: string; system: ControlSystem; graph?: LinkageGraph }) => api<{ linkage: Linkage }>(`/api/builds/${buildId}/linkages`, { body: v }),
    onSuccess: () => { closeAdding(); setError(null); invalidate(); },
    onError,
  });
  // A newcomer's starting run (shared/starter.ts), opened in the editor at once.
  const router = useRouter();
  const starter = useMutation({
    mutationFn: () => api<{ linkage: Linkage }>(`/api/builds/${buildId}/linkages`, { body: { name: STARTER_NAME, system: "pitch", graph: starterPitchRun() } }),
    onSuccess: ({ linkage }) => { invalidate(); router.push(`/builds/${buildId}/linkages/${linkage.id}`); },
    onError,
  });
  const rename = useMutation({
    mutationFn: (v: { id: string; name: string }) => api(`/api/builds/${buildId}/linkages/${v.id}`, { method: "PATCH", body: { name: v.name } }),
    onSuccess: (_r, v) => { closeRenaming(v.id); setError(null); invalidate(); },
    onError,
  });
  const remove = useMutation({
    mutationFn: (id: string) => api(`/api/builds/${buildId}/linkages/${id}`, { method: "DELETE" }),
    onSuccess: () => invalidate(),
    onError,
  });
  /** Rename and Delete of one linkage: in their own column, or under the name on a phone. */
  const actions = (l: Linkage) => (canEdit && renaming !== l.id ? (
    <span className="space-x-1">
      <Button size="sm" tone="ghost" onClick={() => setRenaming(l.id)} data-rename={l.id}>Rename</Button>
      <Button size="sm" tone="ghost" className="text-hazard" onClick={() => { if (window.confirm(`Delete "${l.name}" and all its revisions? This cannot be undone.`)) remove.mutate(l.id); }}>Delete</Button>
    </span>
  ) : null);

  return (
    <Card
      title="Linkages"
      actions={canEdit && !adding ? (
        <>
          <label className="inline-flex cursor-pointer items-center rounded border border-ink/20 bg-white px-2 py-1 text-xs font-medium hover:bg-ink/5 focus-within:outline focus-within:outline-2 focus-within:outline-advisory">
            Import a file
            <input type="file" accept=".json,application/json" className="sr-only" data-testid="import-linkage"
              onChange={(e) => { const f = e.target.files?.[0]; e.target.value = ""; if (f) void importFile(f); }} />
          </label>
          <Button size="sm" onClick={() => setAdding(true)} data-testid="new-linkage">New linkage</Button>
        </>
      ) : null}
    >
      {importErrors ? (
        <div role="alert" className="mb-3 rounded border border-hazard/30 bg-hazard/5 p-2 text-xs" data-testid="import-errors">
          <p className="font-semibold text-hazard">{importErrors.file} is not a linkage file Linkwright can read. Nothing was imported.</p>
          <ul className="mt-1 list-disc pl-5">
            {importErrors.errors.slice(0, 12).map((e, i) => <li key={i}><code>{e.path || "(file)"}</code>: {e.message}</li>)}
          </ul>
          {importErrors.errors.length > 12 ? <p>…and {importErrors.errors.length - 12} more.</p> : null}
        </div>
      ) : null}
      {adding ? (
        <form
          className="mb-4 flex flex-wrap items-end gap-2"
          onKeyDown={escapeCloses(closeAdding)}
          onSubmit={(e) => {
            e.preventDefault();
            const f = new FormData(e.currentTarget);
            create.mutate({ name: String(f.get("name") ?? ""), system: f.get("system") as ControlSystem });
          }}
        >
          <label className="grow text-xs">Name<Input name="name" autoFocus placeholder="e.g. Pitch — stick to elevator" data-testid="linkage-name" /></label>
          <label className="text-xs">System
            <Select name="system" defaultValue="pitch" data-testid="linkage-system">{SYSTEMS.map((s) => <option key={s} value={s}>{SYSTEM_LABEL[s]}</option>)}</Select>
          </label>
          <Button type="submit" disabled={create.isPending} data-testid="create-linkage">{create.isPending ? "Creating…" : "Create"}</Button>
          <Button type="button" tone="ghost" onClick={closeAdding}>Cancel</Button>
        </form>
      ) : null}
      {error ? <p role="alert" className="mb-3 text-xs text-hazard">{error}</p> : null}
      {linkages.length === 0 ? (
        <EmptyState
          title="No linkages yet"
          action={canEdit && !adding ? (
            <div className="flex flex-wrap justify-center gap-2" data-testid="starting-choices">
              <Button size="sm" disabled={starter.isPending} onClick={() => starter.mutate()} data-testid="start-from-starter"
                title="Stick, two pushrods, bellcrank, horn, elevator, brackets and a stop, at placeholder sizes, with every joint's hardware blank">
                {starter.isPending ? "Creating…" : "Start from a typical pitch run"}
              </Button>
              <Button size="sm" tone="secondary" onClick={() => setAdding(true)} data-testid="start-from-nothing">Draw from nothing</Button>
            </div>
          ) : undefined}
        >
          One linkage per control run: pitch, roll, yaw, flaps, trim. Draw it from the pilot&apos;s input to the surface,
          then fill in the hardware at each joint to see loads and findings.
          {canEdit ? " Start from a typical pitch run (its sizes are placeholders for your plans' dimensions), draw one from nothing, or bring a linkage file with Import a file." : ""}
        </EmptyState>
      ) : (
        <div className="table-box">
          <table className="w-full text-left">
            <thead className="text-xs uppercase tracking-wide text-ink-soft">
              <tr className="[&>th]:pr-3"><th className="py-1">Name</th><th>System</th><th>Findings</th><th className="hidden sm:table-cell">Last change</th><th className="sr-only hidden sm:table-cell">Actions</th></tr>
            </thead>
            <tbody>
              {linkages.map((l) => (
                <tr key={l.id} className="border-t border-ink/10 [&>td]:pr-3" data-testid="linkage-row">
                  <td className="py-2">
                    {renaming === l.id ? (
                      <form className="flex gap-1" onKeyDown={escapeCloses(() => closeRenaming(l.id))} onSubmit={(e) => { e.preventDefault(); rename.mutate({ id: l.id, name: String(new FormData(e.currentTarget).get("name")) }); }}>
                        <Input name="name" defaultValue={l.name} autoFocus aria-label="New name" />
                        <Button size="sm" type="submit">Save</Button>
                        <Button size="sm" tone="ghost" type="button" onClick={() => closeRenaming(l.id)}>Cancel</Button>
                      </form>
                    ) : (
                      <Link href={`/builds/${buildId}/linkages/${l.id}`} className="font-medium text-advisory hover:underline">{l.name}</Link>
                    )}
                    {/* On a phone the last change sits under the name: a fifth column would not fit. */}
                    <div className="text-xs text-ink-soft sm:hidden">{lastChange(l)}</div>
                    <div className="-ml-2 sm:hidden">{actions(l)}</div>
                  </td>
                  <td>{SYSTEM_LABEL[l.system]}</td>
                  <td className="space-x-1 sm:whitespace-nowrap" data-testid="linkage-findings" data-state={checkState(l)}>
                    {checkState(l) === "checked" && l.summary ? (
                      <>
                        {l.summary.hazard ? <Badge tone="hazard">{severityCount(l.summary.hazard, "hazard")}</Badge> : null}
                        {l.summary.caution ? <Badge tone="caution">{severityCount(l.summary.caution, "caution")}</Badge> : null}
                        {!l.summary.hazard && !l.summary.caution ? <Badge tone="ok">none open</Badge> : null}
                      </>
                    ) : <Badge>{notCheckedWords(l)}</Badge>}
                  </td>
                  <td className="hidden text-xs text-ink-soft sm:table-cell">{lastChange(l)}</td>
                  <td className="hidden whitespace-nowrap text-right sm:table-cell">{actions(l)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Card>
  );
}
