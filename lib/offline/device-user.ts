/**
 * Which account's records this browser is showing, and where each account's records live.
 *
 * A phone may be shared (a club's timing phone, a family tablet): every account that signs in
 * gets its own device database — its own device id, event sequence, outbox, pull cursor and
 * cached profile — so one account's unsent records are never pushed under another's session,
 * and one account's records are not listed to the next. The choice is kept in localStorage
 * because pages opening offline must know it synchronously, before any IndexedDB read.
 *
 * The first account ever to sign in on a browser takes the base database name, which also
 * holds anything recorded before anyone signed in.
 *
 * Signing out (sign-out.ts) leaves no account in use: the account's database is deleted, or kept
 * sealed while it still holds unsent records, until that account signs in here again. Signed out,
 * the browser uses a database no account holds (the base one if free, else `windowcall-guest`).
 */

/** The part of `Storage` used here (localStorage in a browser, a Map in tests). */
export type KeyValueStore = Pick<Storage, "getItem" | "setItem">;

export const BASE_DB_NAME = "windowcall";
/** The database used signed out while an account still holds the base one. */
export const GUEST_DB_NAME = `${BASE_DB_NAME}-guest`;
const CURRENT_KEY = "windowcall.deviceUser";
const NAMES_KEY = "windowcall.deviceDbs";

type Names = Record<string, string>;

function readNames(store: KeyValueStore): Names {
  try {
    const parsed: unknown = JSON.parse(store.getItem(NAMES_KEY) ?? "{}");
    if (!parsed || typeof parsed !== "object" || Array.isArray(parsed)) return {};
    return Object.fromEntries(Object.entries(parsed).filter((e): e is [string, string] => typeof e[1] === "string"));
  } catch {
    return {};
  }
}

/** The browser's localStorage, or null where there is none (server rendering, storage blocked). */
export function browserStore(): KeyValueStore | null {
  try {
    return typeof window === "undefined" ? null : window.localStorage;
  } catch {
    return null;
  }
}

/** The account this browser last signed in as, or null if none has yet. */
export function currentDeviceUser(store: KeyValueStore | null = browserStore()): string | null {
  if (!store) return null;
  try {
    return store.getItem(CURRENT_KEY) || null; // "" after a sign-out
  } catch {
    return null;
  }
}

/** The device database name of the account now in use (the base name before any sign-in). */
export function currentDbName(store: KeyValueStore | null = browserStore()): string {
  if (!store) return BASE_DB_NAME;
  const user = currentDeviceUser(store);
  const names = readNames(store);
  if (user && names[user]) return names[user];
  // Signed out (or never signed in): never another account's database.
  return Object.values(names).includes(BASE_DB_NAME) ? GUEST_DB_NAME : BASE_DB_NAME;
}

/**
 * Make `userId` the account in use, giving it a database name on its first sign-in here.
 * Returns true when that changed which database is in use.
 */
export function switchDeviceUser(userId: string, store: KeyValueStore | null = browserStore()): boolean {
  if (!store) return false;
  const before = currentDbName(store);
  try {
    const names = readNames(store);
    if (!names[userId]) {
      const taken = new Set(Object.values(names));
      names[userId] = taken.has(BASE_DB_NAME) ? `${BASE_DB_NAME}-${userId}` : BASE_DB_NAME;
      store.setItem(NAMES_KEY, JSON.stringify(names));
    }
    store.setItem(CURRENT_KEY, userId);
  } catch {
    return false; // storage refused the write: stay on the database in use
  }
  return currentDbName(store) !== before;
}

/**
 * Give `userId` a database of its own (`windowcall-<id>`) and make it the one in use: for when
 * the database it was given turns out to hold another account's records (this browser's
 * localStorage was cleared while its IndexedDB was kept). Returns true when that changed it.
 */
export function giveOwnDatabase(userId: string, store: KeyValueStore | null = browserStore()): boolean {
  if (!store) return false;
  const own = `${BASE_DB_NAME}-${userId}`;
  if (currentDbName(store) === own) return false;
  try {
    store.setItem(NAMES_KEY, JSON.stringify({ ...readNames(store), [userId]: own }));
    store.setItem(CURRENT_KEY, userId);
  } catch {
    return false;
  }
  return currentDbName(store) === own;
}

/**
 * Sign-out on this browser: no account is in use any more. With `keep` (unsent records) the
 * account keeps its database name, sealed until it signs in here again; otherwise the name is
 * released (the caller deletes the database). Returns the account's database name, or null when
 * no account was in use.
 */
export function forgetDeviceUser(keep: boolean, store: KeyValueStore | null = browserStore()): string | null {
  const user = currentDeviceUser(store);
  if (!store || !user) return null;
  const names = readNames(store);
  const name = names[user] ?? null;
  try {
    if (!keep && name) {
      delete names[user];
      store.setItem(NAMES_KEY, JSON.stringify(names));
    }
    store.setItem(CURRENT_KEY, "");
  } catch {
    return null;
  }
  return name;
}
