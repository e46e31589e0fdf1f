"use client";
/**
 * Changes made without network, kept on this device (IndexedDB, through idb-keyval) until they can be sent:
 * checklist ticks and notes, and joint photos. When the network returns they are sent in the order they were
 * made. A tick or note whose item someone else changed meanwhile is not sent over theirs: it waits as a
 * conflict, shown beside the item, until the person keeps theirs or the other.
 */
import { createStore, del, entries, set } from "idb-keyval";
import { api, ApiFailure, uploadFile } from "@/components/api-client";

type TickState = { tickedAt: string | null; tickedBy: string | null; note: string };
export type QueuedTick = {
  id: string; kind: "tick"; url: string; revision: number; jointId: string; code: string; ticked: boolean; note?: string;
  /** The item as this device last saw it from the server, before the first offline change. */
  base: TickState;
  at: string;
  /** Someone changed the item meanwhile: their state, waiting for a choice. */
  conflict?: TickState;
};
export type QueuedPhoto = { id: string; kind: "photo"; url: string; jointId: string; name: string; blob: Blob; at: string; error?: string };
export type Queued = QueuedTick | QueuedPhoto;

let store: ReturnType<typeof createStore> | null = null;
const db = () => (store ??= createStore("linkwright-offline", "changes"));
const listeners = new Set<() => void>();
const changed = () => listeners.forEach((f) => f());
export const subscribeQueue = (f: () => void) => (listeners.add(f), () => void listeners.delete(f));

export async function listQueue(): Promise<Queued[]> {
  const all = (await entries<string, Queued>(db())).map(([, v]) => v);
  return all.sort((a, b) => a.at.localeCompare(b.at));
}

/** A tick or note made offline; a later change to the same item replaces it but keeps the first base. */
export async function queueTick(t: Omit<QueuedTick, "id" | "kind" | "at">) {
  const id = `tick|${t.url}|${t.revision}|${t.jointId}|${t.code}`;
  const prev = (await listQueue()).find((q) => q.id === id) as QueuedTick | undefined;
  await set(id, { ...t, id, kind: "tick", base: prev?.base ?? t.base, note: t.note ?? prev?.note, at: prev?.at ?? new Date().toISOString() } satisfies QueuedTick, db());
  changed();
}

export async function queuePhoto(p: { url: string; jointId: string; file: File }) {
  const id = `photo|${crypto.randomUUID()}`;
  await set(id, { id, kind: "photo", url: p.url, jointId: p.jointId, name: p.file.name, blob: p.file, at: new Date().toISOString() } satisfies QueuedPhoto, db());
  changed();
}

async function drop(id: string) {
  await del(id, db());
  changed();
}

const same = (a: TickState, b: TickState) => (a.tickedAt ?? null) === (b.tickedAt ?? null) && (a.note ?? "") === (b.note ?? "");

async function sendTick(t: QueuedTick) {
  await api(t.url, { method: "PUT", body: { revision: t.revision, jointId: t.jointId, code: t.code, ticked: t.ticked, ...(t.note !== undefined ? { note: t.note } : {}) } });
}

let flushing: Promise<void> | null = null;
/** Sends what is queued, oldest first; stops at the first change the network still refuses. */
export function flushQueue(): Promise<void> {
  return (flushing ??= (async () => {
    try {
      for (const q of await listQueue()) {
        if (q.kind === "photo") {
          if (q.error) continue;
          try {
            await uploadFile(q.url, new File([q.blob], q.name, { type: q.blob.type }), q.name);
            await drop(q.id);
          } catch (e) {
            if (e instanceof ApiFailure && e.offline) return;
            await set(q.id, { ...q, error: e instanceof Error ? e.message : String(e) }, db());
            changed();
          }
          continue;
        }
        if (q.conflict) continue;
        try {
          const now = await api<{ items: { jointId: string; code: string; tickedAt: string | null; tickedBy: string | null; note: string }[] }>(`${q.url}?revision=${q.revision}`);
          const item = now.items.find((i) => i.jointId === q.jointId && i.code === q.code);
          const server: TickState = item ? { tickedAt: item.tickedAt, tickedBy: item.tickedBy, note: item.note } : q.base;
          const mine = { ticked: q.ticked, note: q.note ?? server.note };
          if (!!server.tickedAt === mine.ticked && server.note === mine.note) await drop(q.id); // already so
          else if (!same(server, q.base)) {
            await set(q.id, { ...q, conflict: server }, db());
            changed();
          } else {
            await sendTick(q);
            await drop(q.id);
          }
        } catch (e) {
          if (e instanceof ApiFailure && e.offline) return;
          throw e;
        }
      }
    } finally {
      flushing = null;
    }
  })());
}

/** The person's choice on a conflict: send theirs over the other change, or keep the other and drop theirs. */
export async function resolveConflict(id: string, keep: "mine" | "theirs") {
  const q = (await listQueue()).find((x) => x.id === id);
  if (!q || q.kind !== "tick") return;
  if (keep === "mine") await sendTick(q);
  await drop(id);
}

/** A failed photo the person gives up on. */
export const dismissQueued = (id: string) => drop(id);
