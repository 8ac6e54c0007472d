import { describe, expect, it } from "vitest";
import { BASE_DB_NAME, currentDbName, currentDeviceUser, giveOwnDatabase, switchDeviceUser, type KeyValueStore } from "@/lib/offline/device-user";

function memoryStore(): KeyValueStore & { data: Map<string, string> } {
  const data = new Map<string, string>();
  return { data, getItem: (k) => data.get(k) ?? null, setItem: (k, v) => void data.set(k, v) };
}

describe("device databases per account", () => {
  it("uses the base database before anyone signs in, and gives it to the first account", () => {
    const store = memoryStore();
    expect(currentDeviceUser(store)).toBeNull();
    expect(currentDbName(store)).toBe(BASE_DB_NAME);
    expect(switchDeviceUser("ada", store)).toBe(false); // still the base database: nothing to move
    expect(currentDeviceUser(store)).toBe("ada");
    expect(currentDbName(store)).toBe(BASE_DB_NAME);
  });

  it("gives a second account its own database, and each account its own again on return", () => {
    const store = memoryStore();
    switchDeviceUser("ada", store);
    expect(switchDeviceUser("tobi", store)).toBe(true);
    expect(currentDbName(store)).toBe(`${BASE_DB_NAME}-tobi`);
    expect(switchDeviceUser("tobi", store)).toBe(false);
    expect(switchDeviceUser("ada", store)).toBe(true);
    expect(currentDbName(store)).toBe(BASE_DB_NAME);
    expect(switchDeviceUser("tobi", store)).toBe(true);
    expect(currentDbName(store)).toBe(`${BASE_DB_NAME}-tobi`);
  });

  it("falls back to the base database when nothing can be stored or the stored map is damaged", () => {
    expect(currentDbName(null)).toBe(BASE_DB_NAME);
    expect(switchDeviceUser("ada", null)).toBe(false);
    const store = memoryStore();
    store.setItem("windowcall.deviceUser", "ada");
    store.setItem("windowcall.deviceDbs", "not json");
    expect(currentDbName(store)).toBe(BASE_DB_NAME);
    const refusing: KeyValueStore = {
      getItem: () => null,
      setItem: () => {
        throw new Error("QuotaExceededError");
      },
    };
    expect(switchDeviceUser("tobi", refusing)).toBe(false);
    expect(currentDbName(refusing)).toBe(BASE_DB_NAME);
  });

  it("moves an account off a database that turns out to be another's (localStorage cleared, IndexedDB kept)", () => {
    const store = memoryStore(); // cleared: the next account to sign in is handed the base database
    switchDeviceUser("tobi", store);
    expect(currentDbName(store)).toBe(BASE_DB_NAME);
    expect(giveOwnDatabase("tobi", store)).toBe(true);
    expect(currentDbName(store)).toBe(`${BASE_DB_NAME}-tobi`);
    expect(giveOwnDatabase("tobi", store)).toBe(false);
    expect(switchDeviceUser("ada", store)).toBe(true); // the base database is free again for its owner
    expect(currentDbName(store)).toBe(BASE_DB_NAME);
  });
});
