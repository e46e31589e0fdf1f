"use client";
/**
 * Autosave: reads the editor store and PUTs the graph through a react-query mutation ~1.5 s after
 * the last change (or at once on Ctrl/Cmd+S). Tracks saved / saving / unsaved / offline / conflict,
 * and on a 409 keeps the newer revision so the user can load it or keep theirs as a new revision.
 */
import { useCallback, useEffect, useRef, useState } from "react";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useStore } from "zustand";
import type { LinkageGraph } from "@/shared/linkage/schema";
import { api, ApiFailure } from "@/components/api-client";
import { linkageKeys } from "@/components/query-keys";
import type { GraphSaved, Revision } from "@/shared/schemas/graph";
import { PREFER_MINIMAL } from "@/shared/prefer";
import { toGraph, type EditorStore, type Snapshot } from "./store";
import type { SaveStatus } from "./presentation";

export const AUTOSAVE_DELAY = 1500;

export type { SaveStatus };

export type RemoteRevision = Revision;

export function graphUrl(buildId: string, linkageId: string) {
  return `/api/builds/${encodeURIComponent(buildId)}/linkages/${encodeURIComponent(linkageId)}/graph`;
}

export function useAutosave(opts: { store: EditorStore; buildId: string; linkageId: string; enabled: boolean }) {
  const { store, enabled } = opts;
  const url = graphUrl(opts.buildId, opts.linkageId);
  const dirty = useStore(store, (s) => s.dirty);
  const [inFlight, setInFlight] = useState(false);
  const [offline, setOffline] = useState(false);
  const [error, setError] = useState<{ message: string; fields?: unknown } | null>(null);
  const [conflict, setConflict] = useState<RemoteRevision | null>(null);
  const [lastSavedAt, setLastSavedAt] = useState<string | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const busy = useRef(false);
  const conflictRef = useRef<RemoteRevision | null>(null);
  conflictRef.current = conflict;

  const qc = useQueryClient();
  const mutation = useMutation({
    // The editor has the report already (it runs the same engine): the save answers the summary alone.
    mutationFn: (body: { baseRevision: number; graph: LinkageGraph }) => api<GraphSaved>(url, { method: "PUT", body, headers: { prefer: PREFER_MINIMAL } }),
    // A new revision changes the findings, stales sign-offs and adds a history row: the review panels refetch.
    onSuccess: () => qc.invalidateQueries({ queryKey: linkageKeys.review(opts.linkageId) }),
  });
  const mutate = mutation.mutateAsync;

  const saveRef = useRef<() => Promise<string | null>>(async () => null);
  const schedule = useCallback((ms = AUTOSAVE_DELAY) => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      timer.current = null;
      void saveRef.current();
    }, ms);
  }, []);

  /** One save attempt; resolves with why it did not save (null when it did, or there was nothing to do). */
  const save = useCallback(async (): Promise<string | null> => {
    if (!enabled || busy.current || conflictRef.current) return conflictRef.current ? "Someone else saved a newer revision." : null;
    const s = store.getState();
    if (!s.dirty) return null;
    const snapshot: Snapshot = { nodes: s.nodes, joints: s.joints, geometry: s.meta.geometry };
    busy.current = true;
    setInFlight(true);
    try {
      const res = await mutate({ baseRevision: s.revision, graph: toGraph(s, snapshot) });
      store.getState().markSaved(res.revision, snapshot);
      setOffline(false);
      setError(null);
      setLastSavedAt(res.createdAt ?? new Date().toISOString());
      if (store.getState().dirty) schedule();
      return null;
    } catch (e) {
      if (e instanceof ApiFailure && !e.offline) {
        setOffline(false);
        if (e.status === 409 && e.code === "stale_revision") {
          const cur = e.detail<RemoteRevision>("current");
          if (cur) {
            conflictRef.current = cur;
            setConflict(cur);
            return "Someone else saved a newer revision; settle the difference first.";
          }
          setError({ message: e.message });
          return e.message;
        } else if (e.status === 403) {
          const message = "You no longer have permission to edit this linkage; your changes are not saved.";
          setError({ message });
          return message;
        } else if (e.status === 400) {
          const message = `The server refused the linkage: ${e.message}`;
          setError({ message, fields: e.fields });
          return message;
        }
        setError({ message: e.message });
        schedule(10_000);
        return e.message;
      }
      // fetch itself failed: no connection. Try again when the browser says it is back, and every 10 s.
      setOffline(true);
      schedule(10_000);
      return "Offline: the changes could not be saved.";
    } finally {
      busy.current = false;
      setInFlight(false);
    }
  }, [enabled, store, mutate, schedule]);
  saveRef.current = save;

  // Every change while dirty restarts the quiet-period timer.
  useEffect(() => {
    if (!enabled) return;
    return store.subscribe((s, prev) => {
      if (s.dirty && (s.nodes !== prev.nodes || s.joints !== prev.joints || s.meta.geometry !== prev.meta.geometry)) schedule();
    });
  }, [enabled, store, schedule]);

  useEffect(() => {
    const online = () => {
      setOffline(false);
      if (store.getState().dirty) schedule(200);
    };
    const offlineEv = () => setOffline(true);
    window.addEventListener("online", online);
    window.addEventListener("offline", offlineEv);
    return () => {
      window.removeEventListener("online", online);
      window.removeEventListener("offline", offlineEv);
    };
  }, [store, schedule]);

  // Leaving with unsaved work asks first.
  useEffect(() => {
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      if (store.getState().dirty || busy.current) {
        e.preventDefault();
        e.returnValue = "";
      }
    };
    window.addEventListener("beforeunload", onBeforeUnload);
    return () => window.removeEventListener("beforeunload", onBeforeUnload);
  }, [store]);

  useEffect(() => () => void (timer.current && clearTimeout(timer.current)), []);

  /**
   * Saves now and resolves once the linkage is clean on the server (with the revision it is at), or
   * rejects with the reason it is not (conflict, refused, offline, read-only, timeout).
   */
  const saveAndWait = useCallback(
    async (timeoutMs = 20_000): Promise<number> => {
      if (!enabled) throw new Error("This linkage is read-only for you.");
      if (timer.current) clearTimeout(timer.current);
      timer.current = null;
      const until = Date.now() + timeoutMs;
      for (;;) {
        if (conflictRef.current) throw new Error("Someone else saved a newer revision; settle the difference first.");
        const s = store.getState();
        if (!s.dirty && !busy.current) return s.revision;
        if (!busy.current) {
          const reason = await save();
          if (reason) throw new Error(reason);
        } else await new Promise((r) => setTimeout(r, 100));
        if (Date.now() > until) throw new Error("Saving took too long; try again.");
      }
    },
    [enabled, store, save],
  );

  const saveNow = useCallback(() => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    void save();
  }, [save]);

  const loadTheirs = useCallback(() => {
    const c = conflictRef.current;
    if (!c) return;
    store.getState().replaceGraph(c.graph, { revision: c.revision });
    setConflict(null);
    setError(null);
    setLastSavedAt(c.createdAt);
  }, [store]);

  const keepMine = useCallback(() => {
    const c = conflictRef.current;
    if (!c) return;
    store.getState().rebase(c.revision);
    conflictRef.current = null;
    setConflict(null);
    setError(null);
    void save();
  }, [store, save]);

  const status: SaveStatus = !enabled
    ? "readonly"
    : conflict
      ? "conflict"
      : inFlight
        ? "saving"
        : offline
          ? "offline"
          : error
            ? "error"
            : dirty
              ? "unsaved"
              : "saved";

  return { status, error, conflict, lastSavedAt, saveNow, saveAndWait, loadTheirs, keepMine };
}
