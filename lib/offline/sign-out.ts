import Dexie from "dexie";
import { PERSONAL_CACHES } from "./cache-names";
import { releaseWindowcallDb, type WindowcallDb } from "./db";
import { PENDING_SIGN_OUT_COOKIE } from "@/lib/security/pending-sign-out";
import { browserStore, forgetDeviceUser, type KeyValueStore } from "./device-user";

/**
 * Sign-out on a shared phone (a club's timing phone): the next person must not see this account's
 * records, offline included, and no tap may be lost.
 */

/** Records this account has not handed to the server yet (refused ones included: they are kept too). */
export async function countKeptAtSignOut(db: WindowcallDb): Promise<number> {
  return db.outbox.count();
}

/** The part of the Cache Storage API used here (absent outside secure contexts and in tests). */
export type CacheStore = Pick<CacheStorage, "delete">;

/** Delete the service worker's caches of server-rendered pages, which may show this account's data. */
export async function clearPersonalCaches(cacheStore: CacheStore | undefined = globalThis.caches): Promise<void> {
  if (!cacheStore) return;
  await Promise.all(PERSONAL_CACHES.map((name) => cacheStore.delete(name).catch(() => false)));
}

/**
 * Leave this browser with no account in use. With nothing unsent, the account's device database is
 * deleted (its records are on the server and come back at its next sign-in); with unsent records,
 * it is kept, sealed: not opened for anyone else, sent when the same account signs in here again.
 * Returns how many records were kept.
 */
export async function clearAccountOnDevice(
  db: WindowcallDb,
  options: { store?: KeyValueStore | null; caches?: CacheStore } = {},
): Promise<{ kept: number }> {
  const kept = await countKeptAtSignOut(db);
  const store = options.store === undefined ? browserStore() : options.store;
  const name = forgetDeviceUser(kept > 0, store);
  releaseWindowcallDb(); // the page's shared handle, so nothing reopens it
  db.close();
  if (kept === 0 && name) await Dexie.delete(name);
  await clearPersonalCaches(options.caches ?? globalThis.caches);
  return { kept };
}

/** Where the pending mark is kept: the page's cookies (`document`, absent in tests). */
export type CookieJar = { cookie: string };

/**
 * Ends the server session with `serverSignOut` (next-auth's sign-out). Offline that cannot reach the
 * server, so a pending mark (a plain cookie, lib/security/pending-sign-out.ts) is set first and cleared
 * only once the sign-out went through: until then the first request that reaches the server ends the
 * session before a signed-in page is shown. True when the server answered.
 */
export async function endServerSession(serverSignOut: () => Promise<unknown>, jar: CookieJar | undefined = globalThis.document): Promise<boolean> {
  if (jar) jar.cookie = `${PENDING_SIGN_OUT_COOKIE}=1; path=/; max-age=${400 * 24 * 3600}; samesite=lax`;
  try {
    await serverSignOut();
  } catch {
    return false; // offline: the mark stays
  }
  if (jar) jar.cookie = `${PENDING_SIGN_OUT_COOKIE}=; path=/; max-age=0; samesite=lax`;
  return true;
}
