/*
 * Linkwright's service worker: the pages and data a builder has opened keep working in the hangar without
 * network. Pages and GET API answers: network first, the last copy when offline. Built scripts and styles
 * (hashed names under /_next/static/): from the cache once fetched. Writes are never cached here: the pages
 * keep their own queue of changes made offline (components/offline/queue.ts) and send it when the network
 * returns. Signing out empties these caches (components/offline/register.ts).
 */
const VERSION = "lw-offline-v1";
const PAGES = `${VERSION}-pages`;
const STATIC = `${VERSION}-static`;

self.addEventListener("install", () => self.skipWaiting());
self.addEventListener("activate", (event) => {
  event.waitUntil((async () => {
    for (const k of await caches.keys()) if (!k.startsWith(VERSION)) await caches.delete(k);
    await self.clients.claim();
  })());
});

self.addEventListener("message", (event) => {
  if (event.data === "clear") event.waitUntil((async () => { for (const k of await caches.keys()) await caches.delete(k); })());
});

const OFFLINE_PAGE = `<!doctype html><html lang="en"><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>Offline · Linkwright</title>
<body style="font-family:system-ui,sans-serif;max-width:32rem;margin:3rem auto;padding:0 1rem;color:#1f2a37">
<h1>No network, and this page was not opened here before</h1>
<p>Pages you have opened on this device (a linkage's checklist, its editor) work without network; this one has not been opened yet. Go back, or try again when the network is back.</p></body></html>`;

async function networkFirst(request) {
  const cache = await caches.open(PAGES);
  try {
    const res = await fetch(request);
    if (res.ok && res.type === "basic") await cache.put(request, res.clone());
    return res;
  } catch (e) {
    const hit = await cache.match(request, { ignoreVary: true });
    if (hit) return hit;
    if (request.mode === "navigate") return new Response(OFFLINE_PAGE, { status: 503, headers: { "content-type": "text/html; charset=utf-8" } });
    return new Response(JSON.stringify({ error: { code: "offline", message: "No network, and this was not opened on this device before." } }), { status: 503, headers: { "content-type": "application/json" } });
  }
}

async function cacheFirst(request) {
  const cache = await caches.open(STATIC);
  const hit = await cache.match(request);
  if (hit) return hit;
  const res = await fetch(request);
  if (res.ok) await cache.put(request, res.clone());
  return res;
}

self.addEventListener("fetch", (event) => {
  const { request } = event;
  if (request.method !== "GET") return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (url.pathname.startsWith("/api/auth/")) return; // sessions are never served from a cache
  if (url.pathname.includes("/exports/") || url.pathname.endsWith("/download")) return; // files, not pages
  if (url.pathname.includes("/files/") && url.searchParams.get("thumb") !== "1") return; // full-size uploads stay out of the cache; thumbnails are kept
  if (url.pathname.startsWith("/_next/static/") || url.pathname.endsWith(".woff2")) return event.respondWith(cacheFirst(request));
  if (request.mode === "navigate" || url.pathname.startsWith("/api/") || request.headers.get("RSC") === "1") return event.respondWith(networkFirst(request));
});
