"use client";
/**
 * Photos that prove a joint (witness hole, jam nut, washer): thumbnails and an upload button.
 * Used on the checklist; the editor's joint card can host it too (props: buildId, linkageId, jointId, and the
 * joint's name from shared/linkage/names.ts for the labels).
 */
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRef, useState } from "react";
import { api, ACCEPT_PHOTOS, ApiFailure, uploadFile } from "@/components/api-client";
import { dismissQueued, queuePhoto } from "@/components/offline/queue";
import { useOfflineQueue } from "@/components/offline/useQueue";
import { jointKeys } from "@/components/query-keys";
import type { StoredFile } from "@/shared/schemas/files";

export function JointPhotos({ buildId, linkageId, jointId, jointName, canEdit, canRemove = false }: { buildId: string; linkageId: string; jointId: string; jointName: string; canEdit: boolean; canRemove?: boolean }) {
  const url = `/api/builds/${buildId}/linkages/${linkageId}/joints/${encodeURIComponent(jointId)}/photos`;
  const key = jointKeys.photos(linkageId, jointId);
  const qc = useQueryClient();
  const input = useRef<HTMLInputElement>(null);
  const [error, setError] = useState<string | null>(null);
  const photos = useQuery({ queryKey: key, queryFn: async () => (await api<{ photos: StoredFile[] }>(url)).photos });
  const queued = useOfflineQueue().filter((q) => q.kind === "photo" && q.url === url);
  const add = useMutation({
    // Without network a photo is kept on this device and uploaded when the network returns.
    mutationFn: async (files: File[]) => {
      for (const [k, f] of files.entries()) {
        try {
          await uploadFile(url, f);
        } catch (e) {
          if (!(e instanceof ApiFailure && e.offline)) throw e;
          for (const rest of files.slice(k)) await queuePhoto({ url, jointId, file: rest });
          return;
        }
      }
    },
    onSuccess: () => { setError(null); qc.invalidateQueries({ queryKey: key }); },
    onError: (e) => { setError(e instanceof Error ? e.message : String(e)); qc.invalidateQueries({ queryKey: key }); },
  });
  // Detach only (the upload stays in the build's files); offered where the host asks for it (the editor's joint card).
  const remove = useMutation({
    mutationFn: (fileId: string) => api(`${url}/${fileId}`, { method: "DELETE" }),
    onSuccess: () => { setError(null); qc.invalidateQueries({ queryKey: key }); },
    onError: (e) => setError(e instanceof Error ? e.message : String(e)),
  });
  const list = photos.data ?? [];
  return (
    <div className="flex flex-wrap items-center gap-2" data-testid={`joint-photos-${jointId}`}>
      {list.map((p) => (
        <span key={p.id} className="relative">
          <a href={p.url} target="_blank" rel="noreferrer" title={`${p.name}${p.uploadedBy ? ` — ${p.uploadedBy}` : ""}`} className="block rounded border border-ink/15 hover:border-advisory focus:outline-2 focus:outline-advisory">
            {/* eslint-disable-next-line @next/next/no-img-element */}
            <img src={p.thumbUrl ?? p.url} alt={`Photo of the joint ${jointName}: ${p.name}`} width={80} height={56} className="h-14 w-20 rounded bg-slate-100 object-cover" loading="lazy" data-testid="joint-photo-thumb" />
          </a>
          {canEdit && canRemove ? (
            <button type="button" onClick={() => remove.mutate(p.id)} disabled={remove.isPending} aria-label={`Remove ${p.name} from the joint ${jointName}`} title="Remove from this joint (the file stays in the build's uploads)"
              className="group touch-target absolute -right-3 -top-3 flex h-6 w-6 items-center justify-center rounded-full" data-testid="joint-photo-remove">
              {/* The dot is drawn small; the button round it is 24 px (44 px on a touch screen). */}
              <span aria-hidden className="flex h-4 w-4 items-center justify-center rounded-full bg-ink text-[10px] leading-none text-white group-hover:bg-hazard">×</span>
            </button>
          ) : null}
        </span>
      ))}
      {queued.map((q) => q.kind === "photo" && (
        <span key={q.id} className="flex items-center gap-1 rounded border border-dashed border-advisory/50 px-2 py-1 text-xs" data-testid="joint-photo-queued">
          {q.error ? <span className="text-hazard">{q.name}: not uploaded — {q.error} <button type="button" className="underline" onClick={() => void dismissQueued(q.id)}>dismiss</button></span> : <>{q.name} — kept on this device, uploaded when the network is back</>}
        </span>
      ))}
      {list.length === 0 && queued.length === 0 && !photos.isLoading ? <span className="text-xs text-ink-soft">No photo yet — a close-up of the witness hole, jam nut and washer is the evidence an inspector asks for.</span> : null}
      {canEdit ? (
        // The input sits inside its label, so the label draws the ring when Tab reaches the (visually hidden) input.
        <label className="touch-target relative inline-flex min-h-6 cursor-pointer items-center rounded border border-dashed border-ink/30 px-2 py-1 text-xs text-ink-soft hover:border-ink hover:text-ink focus-within:outline focus-within:outline-2 focus-within:outline-offset-2 focus-within:outline-advisory">
          <input ref={input} type="file" accept={ACCEPT_PHOTOS} multiple className="sr-only" aria-label={`Add a photo of the joint ${jointName}`}
            onChange={(e) => { const files = [...(e.target.files ?? [])]; e.target.value = ""; if (files.length) add.mutate(files); }} />
          {add.isPending ? "Uploading…" : "+ Photo"}
        </label>
      ) : null}
      {error ? <span role="alert" className="text-xs text-hazard">{error}</span> : null}
    </div>
  );
}
