import { describe, expect, it } from "vitest";
import { storedOffset } from "@/lib/clock";

describe("storedOffset (an event's three offset columns as its stamp's offset)", () => {
  it("all three set: the estimate, zeros included", () => {
    expect(storedOffset(-42.5, 18, 1_700_000_000_000)).toEqual({ thetaMs: -42.5, deltaMs: 18, measuredAtWallMs: 1_700_000_000_000 });
    expect(storedOffset(0, 0, 0)).toEqual({ thetaMs: 0, deltaMs: 0, measuredAtWallMs: 0 });
  });
  it("any of them missing (null from a row, undefined from an insert): no offset", () => {
    expect(storedOffset(null, 18, 1)).toBeNull();
    expect(storedOffset(5, undefined, 1)).toBeNull();
    expect(storedOffset(5, 18, null)).toBeNull();
  });
});
