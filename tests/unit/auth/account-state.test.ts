import { describe, expect, it } from "vitest";
import { isAccountId, sessionVerdict } from "@/lib/auth/account-state";

describe("sessionVerdict", () => {
  const live = { disabledAt: null, sessionVersion: 3 };

  it("honours a token of the account's current generation", () => {
    expect(sessionVerdict(live, 3)).toBe("current");
  });

  it("refuses a token of an older generation, a gone account and a disabled one", () => {
    expect(sessionVerdict(live, 2)).toBe("stale");
    expect(sessionVerdict(undefined, 3)).toBe("gone");
    expect(sessionVerdict({ disabledAt: new Date(0), sessionVersion: 3 }, 3)).toBe("disabled");
  });

  it("counts a token from before generations existed as generation 0", () => {
    expect(sessionVerdict({ disabledAt: null, sessionVersion: 0 }, undefined)).toBe("current");
    expect(sessionVerdict({ disabledAt: null, sessionVersion: 1 }, undefined)).toBe("stale");
  });
});

describe("isAccountId", () => {
  it("accepts a uuid and nothing else", () => {
    expect(isAccountId("c3643ab3-e580-4f9d-b966-3d6ab17f899b")).toBe(true);
    expect(isAccountId("c3643ab3")).toBe(false);
    expect(isAccountId(undefined)).toBe(false);
    expect(isAccountId(42)).toBe(false);
  });
});
