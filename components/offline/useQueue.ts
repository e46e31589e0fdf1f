"use client";
import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { flushQueue, listQueue, subscribeQueue, type Queued } from "./queue";

/**
 * What is queued on this device (all of it; callers filter), kept current; sends the queue whenever the
 * network comes back (and once on opening), then refreshes every query so the server's state shows.
 */
export function useOfflineQueue(): Queued[] {
  const qc = useQueryClient();
  const [items, setItems] = useState<Queued[]>([]);
  useEffect(() => {
    let live = true;
    const load = () => void listQueue().then((q) => live && setItems(q)).catch(() => {});
    const send = () => void flushQueue().then(() => qc.invalidateQueries()).catch(() => {});
    load();
    const off = subscribeQueue(load);
    if (navigator.onLine) send();
    window.addEventListener("online", send);
    // And every few seconds while something waits: a try made as the network came back may have failed.
    const retry = setInterval(() => {
      if (navigator.onLine) void listQueue().then((q) => { if (q.some((x) => !(x.kind === "tick" && x.conflict) && !(x.kind === "photo" && x.error))) send(); }).catch(() => {});
    }, 5000);
    return () => {
      live = false;
      off();
      clearInterval(retry);
      window.removeEventListener("online", send);
    };
  }, [qc]);
  return items;
}
