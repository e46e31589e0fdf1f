"use client";
import { useState } from "react";
import Link from "next/link";
import { EmptyState, Select } from "@/components/ui";
import { LoadMore, usePagedList } from "@/components/paged";
import type { StoredFile } from "@/shared/schemas/files";

const KIND_LABEL: Record<string, string> = { "": "All files", photo: "Photos", pdf: "Documents (PDF)", "linkage-picture": "Linkage pictures" };

/** Every upload of the build, newest first, a page at a time. */
export function FilesScreen(p: { buildId: string; linkages: { id: string; name: string }[]; first: { files: StoredFile[]; total: number; nextCursor: string | null } }) {
  const [kind, setKind] = useState("");
  const base = `/api/builds/${p.buildId}/files`;
  const list = usePagedList<StoredFile>({ key: ["files", p.buildId, kind], url: kind ? `${base}?kind=${kind}` : base, name: "files", first: kind ? undefined : p.first });
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold">Files</h1>
          <p className="text-ink-soft">Every photo, document and linkage picture uploaded to this build, newest first.</p>
        </div>
        <label className="text-sm">
          <span className="sr-only">Kind of file</span>
          <Select value={kind} onChange={(e) => setKind(e.target.value)} aria-label="Kind of file">
            {Object.entries(KIND_LABEL).map(([k, l]) => <option key={k} value={k}>{l}</option>)}
          </Select>
        </label>
      </div>
      <p className="text-sm text-ink-soft" data-testid="files-total">{list.isPending ? "Loading…" : `${list.total.toLocaleString("en-US")} file${list.total === 1 ? "" : "s"}${kind ? ` of this kind` : " in this build"}.`}</p>
      {!list.isPending && list.items.length === 0 ? (
        <EmptyState title={kind ? "No files of this kind" : "No files yet"}>
          <p>Photos and documents attached to log entries or to joints land here, as do the pictures saved from the linkage editor.</p>
          <ul className="mx-auto mt-3 max-w-md space-y-1 text-left" data-testid="files-where">
            <li>
              <Link className="touch-target inline-flex items-center font-medium text-advisory underline" href={`/builds/${p.buildId}/log`}>Add photos and documents to a build log entry</Link>
            </li>
            {p.linkages.length ? (
              <li>
                A joint&apos;s photos: open a linkage, select the joint and add them on its card —{" "}
                {p.linkages.map((l, i) => (
                  <span key={l.id}>{i ? ", " : ""}<Link className="font-medium text-advisory underline" href={`/builds/${p.buildId}/linkages/${l.id}`}>{l.name}</Link></span>
                ))}
                {" "}(or on its <Link className="font-medium text-advisory underline" href={`/builds/${p.buildId}/checklist`}>inspection checklist</Link>).
              </li>
            ) : (
              <li>
                A joint&apos;s photos: <Link className="font-medium text-advisory underline" href={`/builds/${p.buildId}`}>draw a linkage on the overview</Link> first, then add them on each joint&apos;s card.
              </li>
            )}
          </ul>
        </EmptyState>
      ) : (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4 lg:grid-cols-6" aria-label="Files">
          {list.items.map((f) => (
            <li key={f.id} className="overflow-hidden rounded border border-ink/10 bg-white text-xs" data-testid="file-card">
              <a href={f.url} target="_blank" rel="noreferrer" className="block">
                {f.thumbUrl ? (
                  // eslint-disable-next-line @next/next/no-img-element
                  <img src={f.thumbUrl} alt={f.name} loading="lazy" className="h-28 w-full bg-paper object-cover" />
                ) : <div className="flex h-28 items-center justify-center bg-paper text-ink-soft">{f.kind === "pdf" ? "PDF" : "file"}</div>}
                <p className="truncate px-2 pt-1 font-medium" title={f.name}>{f.name}</p>
              </a>
              <p className="px-2 pb-1 text-ink-soft">{f.createdAt.slice(0, 10)}{f.uploadedBy ? ` · ${f.uploadedBy}` : ""}</p>
            </li>
          ))}
        </ul>
      )}
      <LoadMore shown={list.items.length} total={list.total} noun="files" hasMore={!!list.hasNextPage} loading={list.isFetchingNextPage} error={list.isFetchNextPageError ? list.error : null} onMore={() => void list.fetchNextPage()} />
    </div>
  );
}
