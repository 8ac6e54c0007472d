import Dexie from "dexie";
import { describe, expect, it } from "vitest";
import { isQuotaError, requestPersistence } from "@/lib/offline/storage";

describe("requestPersistence", () => {
  it("reports unsupported without navigator.storage.persist", async () => {
    expect(await requestPersistence(undefined)).toBe("unsupported");
    expect(await requestPersistence({})).toBe("unsupported");
  });

  it("returns the browser's answer", async () => {
    expect(await requestPersistence({ persist: async () => true })).toBe("persisted");
    expect(await requestPersistence({ persist: async () => false })).toBe("not-persisted");
  });

  it("does not ask again when already persisted", async () => {
    let asked = 0;
    const storage = { persisted: async () => true, persist: async () => (asked++, true) };
    expect(await requestPersistence(storage)).toBe("persisted");
    expect(asked).toBe(0);
  });

  it("treats a throwing persist() as not persisted", async () => {
    expect(await requestPersistence({ persist: async () => Promise.reject(new Error("x")) })).toBe("not-persisted");
  });
});

describe("isQuotaError", () => {
  it("recognises Dexie's and the DOM's quota errors, also when wrapped", () => {
    expect(isQuotaError(new Dexie.QuotaExceededError("full"))).toBe(true);
    expect(isQuotaError(new DOMException("full", "QuotaExceededError"))).toBe(true);
    expect(isQuotaError(new Dexie.AbortError("aborted", new DOMException("full", "QuotaExceededError")))).toBe(true);
    expect(isQuotaError(new Error("write failed", { cause: { name: "NS_ERROR_DOM_QUOTA_REACHED" } }))).toBe(true);
  });

  it("is false for other errors", () => {
    expect(isQuotaError(new Dexie.ConstraintError("dup"))).toBe(false);
    expect(isQuotaError(new TypeError("Failed to fetch"))).toBe(false);
    expect(isQuotaError("QuotaExceededError")).toBe(false);
    expect(isQuotaError(null)).toBe(false);
  });
});
