import { describe, expect, it } from "vitest";
import { decisionChangeLine } from "@/lib/days/summary";

describe("decisionChangeLine (the updated summary's first line)", () => {
  it("names the lane, whose record counts now and both results", () => {
    expect(decisionChangeLine({ pilot: "Pia", taskCode: "B", startText: "10:00 CEST", recorder: "Oren", beforeTenths: 1600, afterTenths: 1050 }))
      .toBe("Pia's window at 10:00 CEST (task B): the record of Oren's phone counts now, 105.0 s (was 160.0 s).");
  });
  it("a decision taken back: the rules' pick again; no result is said so", () => {
    expect(decisionChangeLine({ pilot: "Pia", taskCode: "custom", startText: "10:00 UTC", recorder: null, beforeTenths: null, afterTenths: 1600 }))
      .toBe("Pia's window at 10:00 UTC (custom task): the record the rules pick counts again, 160.0 s (was no result).");
  });
});
