import { describe, expect, it } from "vitest";
import { consentStatus, countsForPilot, listedForPilot } from "@/lib/sync/consent";

describe("a lane's standing in its pilot's record", () => {
  it("a lane the pilot recorded themselves is their own and counts by nature", () => {
    expect(consentStatus("ada", "ada", null)).toBe("own");
    expect(countsForPilot("own")).toBe(true);
  });

  it("a lane a club mate recorded is pending until the pilot accepts it; disputed and hidden never count", () => {
    expect(consentStatus("tobi", "ada", null)).toBe("pending");
    expect(countsForPilot("pending")).toBe(false);
    expect(countsForPilot(consentStatus("tobi", "ada", "accepted"))).toBe(true);
    expect(countsForPilot(consentStatus("tobi", "ada", "disputed"))).toBe(false);
    expect(countsForPilot(consentStatus("tobi", "ada", "hidden"))).toBe(false);
  });

  it("hidden lanes leave the pilot's lists; pending and disputed stay listed", () => {
    expect(listedForPilot("hidden")).toBe(false);
    expect(listedForPilot("pending")).toBe(true);
    expect(listedForPilot("disputed")).toBe(true);
  });

  it("a guest's lane belongs to no account's record", () => {
    expect(consentStatus("tobi", null, null)).toBeNull();
    expect(countsForPilot(null)).toBe(false);
  });
});
