import { describe, expect, it } from "vitest";
import { scoreTask } from "@/lib/tasks";
import { normaliseGroup } from "@/lib/scoring";
import { backToBack } from "../unit/tasks/helpers";

// Source: FAI Sporting Code, Section 4, Volume F3 Soaring, 2025 edition (v2), class F3K,
// as digested in /work/shared/RULES.md ("Published examples in the rules"). Paragraph
// numbers of the tasks follow the rulebook's order A = F3K.11.1 … N = F3K.11.14.

describe("published examples of the 2025 rules", () => {
  it("F3K.11.2 task B: flights 65, 45, 55, 85 → 55 + 85 = 140 s", () => {
    expect(scoreTask({ task: "B", flights: backToBack([65, 45, 55, 85]) }).seconds).toBe(140);
  });

  it("F3K.11.5 task E: targets 45 (46 reached), 50 (48 missed, 52 reached), 47 (49 reached) → 142 s", () => {
    const flights = [
      { launchMs: 0, landMs: 46_000, targetSec: 45 },
      { launchMs: 47_000, landMs: 95_000, targetSec: 50 },
      { launchMs: 96_000, landMs: 148_000 }, // second attempt at 50: the target stays
      { launchMs: 149_000, landMs: 198_000, targetSec: 47 },
    ];
    expect(scoreTask({ task: "E", flights }).seconds).toBe(142);
  });

  it("F3K.11.8 task H: flights 63, 239, 182, 90 → 60 + 239 + 180 + 90 = 569 s", () => {
    expect(scoreTask({ task: "H", flights: backToBack([63, 239, 182, 90]) }).seconds).toBe(569);
  });

  it("F3K.11.10 task J: flights 150, 45, 180, 150 → 45 + 180 + 150 = 375 s", () => {
    expect(scoreTask({ task: "J", flights: backToBack([150, 45, 180, 150]) }).seconds).toBe(375);
  });

  it("F3K.11.3 task C normalisation: 130, 160, 150 s → 812.5, 1000.0, 937.5 points", () => {
    const results = [130, 160, 150].map((s) => scoreTask({ task: "C", flights: [{ launchMs: 1000, landMs: 1000 + s * 1000 }] }).seconds);
    expect(results).toEqual([130, 160, 150]);
    expect(normaliseGroup(results)).toEqual([812.5, 1000, 937.5]);
  });

  it("F3K.7 sum cap: task G in 10 min scores at most 595 s", () => {
    // Five 120.5 s flights 0.3 s apart: 602.5 s of airtime in 600 s is impossible, so use
    // flights of 119.9 s → 5 × 119.9 = 599.5 s flown, capped to 600 − 5 = 595 s.
    const r = scoreTask({ task: "G", flights: backToBack([119.9, 119.9, 119.9, 119.9, 119.9], 100) });
    expect(r.seconds).toBe(595);
    expect(r.sumCapApplied).toBe(true);
  });

  it("F3K.7 sum cap: task H scores at most 596 s", () => {
    // 240.2 + 180.1 + 120.1 + 59.5 flown with 0.01 s between: 240 + 180 + 120 + 59.5 = 599.5 → 596.
    const r = scoreTask({ task: "H", flights: backToBack([240.2, 180.1, 120.1, 59.5], 10) });
    expect(r.seconds).toBe(596);
  });

  it("F3K.7 truncation: 183.96 s is recorded as 183.9 s, never rounded up", () => {
    const r = scoreTask({ task: "D", flights: [{ launchMs: 0, landMs: 183_960 }] });
    expect(r.seconds).toBe(183.9);
  });
});
