import Dexie from "dexie";
import { describe, expect, it } from "vitest";
import { createWindowcallDb, setMeta } from "@/lib/offline/db";
import {
  BASE_DB_NAME,
  currentDbName,
  currentDeviceUser,
  forgetDeviceUser,
  GUEST_DB_NAME,
  switchDeviceUser,
  type KeyValueStore,
} from "@/lib/offline/device-user";
import { clearAccountOnDevice, type CacheStore } from "@/lib/offline/sign-out";

function memoryStore(): KeyValueStore {
  const data = new Map<string, string>();
  return { getItem: (k) => data.get(k) ?? null, setItem: (k, v) => void data.set(k, v) };
}

function fakeCaches(names: string[]): CacheStore & { names: Set<string> } {
  const set = new Set(names);
  return { names: set, delete: async (name) => set.delete(name) };
}

/** An account signed in on `store` whose device database holds a profile and `unsent` outbox entries. */
async function signedIn(store: KeyValueStore, userId: string, unsent: number) {
  switchDeviceUser(userId, store);
  const db = createWindowcallDb(currentDbName(store));
  await setMeta(db, "profile", { id: userId, name: userId, email: `${userId}@example.com` });
  for (let i = 0; i < unsent; i++) await db.outbox.add({ id: `${userId}-${i}`, kind: "event", createdAt: i, queueSeq: i, attempts: 0 });
  return db;
}

describe("signing out of a shared phone", () => {
  it("leaves no account in use, and never opens another account's database signed out", () => {
    const store = memoryStore();
    switchDeviceUser("ada", store);
    expect(forgetDeviceUser(true, store)).toBe(BASE_DB_NAME); // ada keeps the base database, sealed
    expect(currentDeviceUser(store)).toBeNull();
    expect(currentDbName(store)).toBe(GUEST_DB_NAME);
    expect(switchDeviceUser("ada", store)).toBe(true); // back to her own, sealed one
    expect(currentDbName(store)).toBe(BASE_DB_NAME);
    expect(forgetDeviceUser(false, store)).toBe(BASE_DB_NAME); // released: free for whoever comes next
    expect(currentDbName(store)).toBe(BASE_DB_NAME);
    expect(forgetDeviceUser(false, store)).toBeNull(); // nobody signed in
  });

  it("deletes the database of an account with nothing unsent, and the caches of personal pages", async () => {
    const store = memoryStore();
    const db = await signedIn(store, "ada", 0);
    const caches = fakeCaches(["pages", "rsc", "static", "serwist-precache-v2"]);
    expect(await clearAccountOnDevice(db, { store, caches })).toEqual({ kept: 0 });
    expect(await Dexie.exists(BASE_DB_NAME)).toBe(false);
    expect([...caches.names].sort()).toEqual(["serwist-precache-v2", "static"]);
    // the next person on the phone opens an empty database
    const next = createWindowcallDb(currentDbName(store));
    expect(await next.meta.count()).toBe(0);
    await next.delete();
  });

  it("keeps unsent records sealed for their own account, never shown to the next one", async () => {
    const store = memoryStore();
    await signedIn(store, "ada", 0).then((db) => clearAccountOnDevice(db, { store, caches: fakeCaches([]) }));
    const tobi = await signedIn(store, "tobi", 0); // takes the base database ada released
    await clearAccountOnDevice(tobi, { store, caches: fakeCaches([]) });
    const cara = await signedIn(store, "cara", 3);
    const caraDbName = cara.name;
    expect(await clearAccountOnDevice(cara, { store, caches: fakeCaches([]) })).toEqual({ kept: 3 });
    expect(await Dexie.exists(caraDbName)).toBe(true);

    // Signed out, and then another account: neither opens cara's records.
    const guest = createWindowcallDb(currentDbName(store));
    expect(guest.name).not.toBe(caraDbName);
    expect(await guest.outbox.count()).toBe(0);
    guest.close();
    switchDeviceUser("dan", store);
    expect(currentDbName(store)).not.toBe(caraDbName);

    // cara signs in again: her own database, her three records still waiting to be sent.
    switchDeviceUser("cara", store);
    expect(currentDbName(store)).toBe(caraDbName);
    const again = createWindowcallDb(currentDbName(store));
    expect(await again.outbox.count()).toBe(3);
    await again.delete();
  });
});
