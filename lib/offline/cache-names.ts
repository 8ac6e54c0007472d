/**
 * The service worker's runtime caches (worker/sw.ts). Pages and RSC payloads rendered by the
 * server may hold the signed-in account's data (the home page lists its sessions), so sign-out
 * deletes them; the precached app shell and the static assets hold nothing personal and stay.
 */
export const PAGES_CACHE = "pages";
export const RSC_CACHE = "rsc";
export const STATIC_CACHE = "static";

/** The caches emptied at sign-out. */
export const PERSONAL_CACHES = [PAGES_CACHE, RSC_CACHE] as const;
