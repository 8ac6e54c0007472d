import { describe, expect, it } from "vitest";
import { canRetryMail, mailState } from "@/lib/admin/mail-state";

const at = new Date("2026-12-03T10:00:00Z");

describe("mailState", () => {
  it.each([
    [{ sentAt: at, nextAttemptAt: null, lastError: null }, "sent", false],
    [{ sentAt: null, nextAttemptAt: at, lastError: null }, "queued", false],
    [{ sentAt: null, nextAttemptAt: at, lastError: "connection refused" }, "retrying", true],
    [{ sentAt: null, nextAttemptAt: null, lastError: "connection refused" }, "failed", true],
  ] as const)("%o is %s (retry allowed: %s)", (facts, state, retry) => {
    expect(mailState(facts)).toBe(state);
    expect(canRetryMail(facts)).toBe(retry);
  });
});
