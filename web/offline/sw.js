// Saltcast's service worker, served by the Saltcast worker at /sw.js so a tablet can keep the
// app and open it with no network. The file opened from disk never registers it.
//
// - install: the app (the page at /, its manifest and icons) goes into a cache named for
//   this version; the new worker then WAITS, so a page in use is never swapped under the
//   user's hands;
// - the page sees the waiting worker and asks "a new version is ready — update?"; only when
//   the user agrees does it post {saltcast: "activate-update"}, and only then does this
//   worker take over (skipWaiting) and drop the caches of older versions;
// - fetch: the app's own files come from the cache first (offline they come only from
//   there); everything else, the JSON API included, goes to the network untouched.
// Recipes live in the page's localStorage, which belongs to the origin and not to a cache,
// so an update does not touch them.
"use strict";

// The Saltcast worker puts the version of the app it serves here (and the checksum of the
// page, so every new page is a new service worker).
const VERSION = "{{SW_VERSION}}";
const PREFIX = "saltcast-app-";
const CACHE = PREFIX + VERSION;
const APP = [
  "/",
  "/manifest.webmanifest",
  "/icons/icon-192.png",
  "/icons/icon-512.png",
  "/icons/icon-maskable-512.png",
  "/icons/apple-touch-icon.png",
];

self.addEventListener("install", (event) => {
  // cache: "reload" skips the HTTP cache, so the files are those of this version.
  event.waitUntil(
    caches.open(CACHE).then((cache) =>
      cache.addAll(APP.map((path) => new Request(path, { cache: "reload" })))),
  );
});

self.addEventListener("activate", (event) => {
  event.waitUntil((async () => {
    for (const key of await caches.keys()) {
      if (key.startsWith(PREFIX) && key !== CACHE) {
        await caches.delete(key);
      }
    }
    // The first version takes the open page at once (there is nothing to replace).
    await self.clients.claim();
  })());
});

self.addEventListener("message", (event) => {
  if (event.data && event.data.saltcast === "activate-update") {
    self.skipWaiting();
  }
});

self.addEventListener("fetch", (event) => {
  const req = event.request;
  if (req.method !== "GET") {
    return;
  }
  const url = new URL(req.url);
  if (url.origin !== self.location.origin) {
    return;
  }
  // A visit to the app with a query (or none) is the app; the fragment never reaches here.
  const path = req.mode === "navigate" && url.pathname === "/" ? "/" : url.pathname;
  if (!APP.includes(path) || (path !== "/" && url.search !== "")) {
    return;
  }
  event.respondWith((async () => {
    const cache = await caches.open(CACHE);
    const hit = await cache.match(path);
    if (hit) {
      return hit;
    }
    const res = await fetch(req);
    if (res.ok && res.type === "basic") {
      await cache.put(path, res.clone());
    }
    return res;
  })());
});
