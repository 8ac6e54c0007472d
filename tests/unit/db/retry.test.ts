import { describe, expect, it } from "vitest";
import { retryAborted, sqlState } from "@/db/retry";

/** SQLSTATE codes from PostgreSQL's documentation, Appendix A "PostgreSQL Error Codes": 40P01 deadlock_detected, 40001 serialization_failure, 23505 unique_violation. */
const pgError = (code: string) => Object.assign(new Error(`pg ${code}`), { code });
const wrapped = (code: string) => Object.assign(new Error("Failed query"), { cause: pgError(code) });

describe("retryAborted", () => {
  it("runs a transaction PostgreSQL aborted as a deadlock again, and returns its answer", async () => {
    let calls = 0;
    const out = await retryAborted(async () => {
      calls++;
      if (calls === 1) throw wrapped("40P01");
      return "acks";
    });
    expect(out).toBe("acks");
    expect(calls).toBe(2);
  });

  it("runs a serialization failure again too", async () => {
    let calls = 0;
    await expect(retryAborted(async () => (++calls < 3 ? Promise.reject(pgError("40001")) : calls))).resolves.toBe(3);
  });

  it("gives up after three tries with the last error", async () => {
    let calls = 0;
    await expect(retryAborted(async () => { calls++; throw wrapped("40P01"); })).rejects.toThrow("Failed query");
    expect(calls).toBe(3);
  });

  it("never runs again what failed for another reason", async () => {
    let calls = 0;
    await expect(retryAborted(async () => { calls++; throw wrapped("23505"); })).rejects.toThrow();
    await expect(retryAborted(async () => { calls++; throw new Error("no code"); })).rejects.toThrow("no code");
    expect(calls).toBe(2);
  });

  it("reads the code on the error or on what it wraps", () => {
    expect(sqlState(pgError("40P01"))).toBe("40P01");
    expect(sqlState(wrapped("40001"))).toBe("40001");
    expect(sqlState(new Error("x"))).toBeUndefined();
    expect(sqlState(null)).toBeUndefined();
  });
});
