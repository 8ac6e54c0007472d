/// <reference lib="webworker" />
import type { PrecacheEntry, SerwistGlobalConfig } from "serwist";
import { NetworkFirst, NetworkOnly, Serwist, StaleWhileRevalidate } from "serwist";
import { PAGES_CACHE, RSC_CACHE, STATIC_CACHE } from "../lib/offline/cache-names";

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}
declare const self: ServiceWorkerGlobalScope;

/**
 * The field works with no signal: the app's assets and the field pages are precached at install;
 * other pages are network-first with the last copy as the fallback, then the offline page.
 * Data is never read from these caches — it lives in IndexedDB (lib/offline). Sign-out deletes the
 * page caches, which may hold an account's data (lib/offline/cache-names.ts).
 */
const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  precacheOptions: { ignoreURLParametersMatching: [/.*/], cleanupOutdatedCaches: true },
  skipWaiting: true,
  clientsClaim: true,
  navigationPreload: false,
  runtimeCaching: [
    { matcher: ({ url }) => url.pathname.startsWith("/api/"), handler: new NetworkOnly() },
    // Administration shows other people's accounts: never kept on a device (offline it is the offline page).
    { matcher: ({ url }) => url.pathname === "/admin" || url.pathname.startsWith("/admin/"), handler: new NetworkOnly() },
    {
      matcher: ({ request }) => request.mode === "navigate",
      handler: new NetworkFirst({ cacheName: PAGES_CACHE, networkTimeoutSeconds: 4 }),
    },
    {
      matcher: ({ request, url }) => request.headers.get("RSC") === "1" || url.searchParams.has("_rsc"),
      handler: new NetworkFirst({ cacheName: RSC_CACHE, networkTimeoutSeconds: 4 }),
    },
    {
      matcher: ({ url, sameOrigin }) => sameOrigin && /\.(?:png|svg|ico|webmanifest|woff2)$/.test(url.pathname),
      handler: new StaleWhileRevalidate({ cacheName: STATIC_CACHE }),
    },
  ],
  fallbacks: {
    entries: [{ url: "/offline", matcher: ({ request }) => request.destination === "document" }],
  },
});

serwist.addEventListeners();
