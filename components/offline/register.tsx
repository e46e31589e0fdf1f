"use client";
import { useEffect } from "react";

/**
 * Registers the service worker (public/sw.js) in a production build, so the pages and data opened here keep
 * working without network. Not in `next dev`, where every script changes on each edit.
 */
export function ServiceWorker() {
  useEffect(() => {
    if (process.env.NODE_ENV !== "production" || !("serviceWorker" in navigator)) return;
    navigator.serviceWorker.register("/sw.js", { scope: "/" }).catch((e) => console.warn("[offline] the service worker was not registered:", e));
  }, []);
  return null;
}

/** Signing out: the cached pages and answers of this account are removed from the device. */
export async function clearOfflineCopies() {
  try {
    navigator.serviceWorker?.controller?.postMessage("clear");
    if ("caches" in window) for (const k of await caches.keys()) await caches.delete(k);
  } catch {
    // nothing cached, or the browser keeps no caches here
  }
}
