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
    return () => {
      live = false;
      off();
      window.removeEventListener("online", send);
    };
  }, [qc]);
  return items;
}
