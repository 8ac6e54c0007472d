/**
 * Storage durability and quota (SYNC.md §2): Safari deletes script storage of sites unused
 * for 7 days unless it is persisted, and a full disk must be shown, not swallowed.
 */

export type PersistenceOutcome = "persisted" | "not-persisted" | "unsupported";

type StorageLike = { persisted?: () => Promise<boolean>; persist?: () => Promise<boolean> };

/**
 * Ask the browser to keep our storage (`navigator.storage.persist()`), returning what it
 * decided. Already-persisted storage is reported without asking again.
 */
export async function requestPersistence(
  storage: StorageLike | undefined = globalThis.navigator?.storage,
): Promise<PersistenceOutcome> {
  if (!storage?.persist) return "unsupported";
  try {
    if (storage.persisted && (await storage.persisted())) return "persisted";
    return (await storage.persist()) ? "persisted" : "not-persisted";
  } catch {
    return "not-persisted";
  }
}

const QUOTA_NAMES = new Set(["QuotaExceededError", "NS_ERROR_DOM_QUOTA_REACHED"]);

/**
 * Whether an error (from Dexie or IndexedDB) means the storage quota is exhausted:
 * Dexie's QuotaExceededError, a DOMException of that name (legacy code 22), or either
 * wrapped as the `inner` error of a Dexie AbortError or as an error's `cause`.
 */
export function isQuotaError(e: unknown, depth = 0): boolean {
  if (depth > 5 || typeof e !== "object" || e === null) return false;
  const err = e as { name?: unknown; code?: unknown; inner?: unknown; cause?: unknown };
  if (typeof err.name === "string" && QUOTA_NAMES.has(err.name)) return true;
  if (err.code === 22 && typeof DOMException !== "undefined" && e instanceof DOMException) return true;
  return isQuotaError(err.inner, depth + 1) || isQuotaError(err.cause, depth + 1);
}
