import { describe, expect, it } from "vitest";
import { CATALOGUE, getCatalogueTask, listVariants, maxResultTenths, parseTaskDefinition, scoreTask } from "@/lib/tasks";
import { backToBack } from "./helpers";

// Hand-worked cases for every task and variant of the 2025 catalogue (F3K.11, RULES.md).
// Each comment shows the arithmetic done by hand.

describe("catalogue data", () => {
  it("lists every task A–N with the working-time variants of RULES.md", () => {
    expect(Object.keys(CATALOGUE)).toEqual(["A", "B", "C", "D", "E", "F", "G", "H", "I", "J", "K", "L", "M", "N"]);
    expect(listVariants("A")).toEqual([600, 420]);
    expect(listVariants("B")).toEqual([600, 420]);
    expect(listVariants("C")).toEqual([3, 4, 5]);
    expect(listVariants("E")).toEqual([600, 900]);
    expect(listVariants("L")).toEqual([600, 420]);
    expect(listVariants("M")).toEqual([900]);
  });

  it("every entry passes its own schema and is tagged with the 2025 edition", () => {
    for (const variants of Object.values(CATALOGUE)) {
      for (const def of variants) {
        expect(parseTaskDefinition(def)).toEqual(def);
        expect(def.edition).toBe("F3K-2025");
      }
    }
  });

  it("getCatalogueTask returns a copy a run can store, and rejects unknown variants", () => {
    const a = getCatalogueTask("A", 420);
    expect(a.kind === "window" && a.workingTimeSec).toBe(420);
    expect(a).not.toBe(CATALOGUE.A[1]);
    expect(() => getCatalogueTask("D", 420)).toThrow(/no variant 420.*600/);
  });

  it("maxima follow caps, targets and the F3K.7 sum cap", () => {
    const max = (l: Parameters<typeof getCatalogueTask>[0], v?: number) => maxResultTenths(getCatalogueTask(l, v)) / 10;
    expect(max("A")).toBe(300); // one flight capped at 300
    expect(max("B")).toBe(480); // 2 × 240
    expect(max("B", 420)).toBe(360); // 2 × 180
    expect(max("C", 5)).toBe(900); // 5 × 180
    expect(max("D")).toBe(598); // 2 × 300 = 600 > 600 − 2
    expect(max("E")).toBe(599); // one target of 599 s beats three targets (600 − 3)
    expect(max("F")).toBe(540); // 3 × 180
    expect(max("G")).toBe(595); // F3K.7 example
    expect(max("H")).toBe(596); // F3K.7 example
    expect(max("I")).toBe(597); // 3 × 200 = 600 > 600 − 3
    expect(max("J")).toBe(540);
    expect(max("K")).toBe(595); // 60+90+120+150+180 = 600 > 600 − 5
    expect(max("L")).toBe(599);
    expect(max("L", 420)).toBe(419);
    expect(max("M")).toBe(897); // 180+300+420 = 900 > 900 − 3
    expect(max("N")).toBe(599);
  });
});

describe("task A — last flight (F3K.11.1)", () => {
  it("10 min: only the last flight counts, capped at 300 s", () => {
    // 310 → capped 300, then a 120.47 s flight cancels it: 120.4 s.
    expect(scoreTask({ task: "A", flights: backToBack([310, 120.47]) }).seconds).toBe(120.4);
    expect(scoreTask({ task: "A", flights: backToBack([100, 310]) }).seconds).toBe(300);
  });
  it("7 min variant: same rule in 420 s", () => {
    // 150 then 250 (lands at 401 s): last = 250.
    expect(scoreTask({ task: "A", workingTimeSec: 420, flights: backToBack([150, 250]) }).seconds).toBe(250);
    // 200 then 250: the second lands at 451 s, after the 420 + 30 s landing window → zero.
    expect(scoreTask({ task: "A", workingTimeSec: 420, flights: backToBack([200, 250]) }).seconds).toBe(0);
  });
});

describe("task B — next to last and last (F3K.11.2)", () => {
  it("10 min: cap 240", () => {
    // 250 → 240 counts with 200: 440.
    expect(scoreTask({ task: "B", flights: backToBack([100, 250, 200]) }).seconds).toBe(440);
  });
  it("7 min: cap 180", () => {
    // 190 → 180, 170: 350.
    expect(scoreTask({ task: "B", workingTimeSec: 420, flights: backToBack([190, 170]) }).seconds).toBe(350);
  });
});

describe("task C — all up, last down (F3K.11.3)", () => {
  const attempt = (launchMs: number, flownSec: number | null) => ({ launchMs, landMs: flownSec === null ? null : launchMs + flownSec * 1000 });
  it("3 attempts: times added, each capped at 180 s", () => {
    // 150 + 185→180 + 179.99→179.9 = 509.9
    const r = scoreTask({ task: "C", flights: [attempt(500, 150), attempt(2000, 185), attempt(0, 179.99)] });
    expect(r.seconds).toBe(509.9);
  });
  it("4 and 5 attempts: attempts not flown score zero", () => {
    // 4 attempts, 2 flown: 100 + 120 = 220; 5 attempts, 3 flown of 180: 540.
    expect(scoreTask({ task: "C", attempts: 4, flights: [attempt(0, 100), attempt(0, 120)] }).seconds).toBe(220);
    expect(scoreTask({ task: "C", attempts: 5, flights: [attempt(0, 180), attempt(0, 180), attempt(0, 180)] }).seconds).toBe(540);
  });
  it("a launch before the signal or later than 3 s scores zero for that attempt", () => {
    // −1 ms and 3001 ms: zero; 3000 ms exactly: in time → 100.
    const r = scoreTask({ task: "C", flights: [attempt(-1, 100), attempt(3001, 100), attempt(3000, 100)] });
    expect(r.seconds).toBe(100);
    expect(r.flights.map((f) => f.reason)).toEqual(["launched-before-signal", "launched-late", null]);
  });
  it("a landing after 3:33 from the signal scores zero; 3:33.000 exactly is in time", () => {
    // launch at 3 s, landing at 213.000 s → 210 s flown → capped 180. At 213.001 s → zero.
    const r = scoreTask({ task: "C", flights: [{ launchMs: 3000, landMs: 213_000 }, { launchMs: 3000, landMs: 213_001 }] });
    expect(r.flights.map((f) => f.countedTenths)).toEqual([1800, 0]);
  });
});

describe("task D — two flights (F3K.11.4)", () => {
  it("both of at most two launches count, cap 300; a third launch does not count", () => {
    // 320 → 300, 250, third 200 ignored: 550.
    const r = scoreTask({ task: "D", flights: backToBack([320, 250, 200]) });
    expect(r.seconds).toBe(550);
    expect(r.flights[2]).toMatchObject({ status: "not-counted", reason: "beyond-launch-limit" });
  });
});

describe("task E — poker (F3K.11.5)", () => {
  it("10 min: at most three reached targets are credited", () => {
    // Targets 100 (reached at 101), 150 (reached at 155), 120 (reached 121), then a 4th flight: 370.
    const flights = [
      { launchMs: 0, landMs: 101_000, targetSec: 100 },
      { launchMs: 102_000, landMs: 257_000, targetSec: 150 },
      { launchMs: 258_000, landMs: 379_000, targetSec: 120 },
      { launchMs: 380_000, landMs: 440_000, targetSec: 50 },
    ];
    const r = scoreTask({ task: "E", flights });
    expect(r.seconds).toBe(370);
    expect(r.flights[3]).toMatchObject({ status: "not-counted", reason: "after-final-target" });
  });
  it("15 min: a target of 400 s reached once, a target of 300 s never reached → 400", () => {
    const flights = [
      { launchMs: 0, landMs: 401_000, targetSec: 400 },
      { launchMs: 402_000, landMs: 600_000, targetSec: 300 },
      { launchMs: 601_000, landMs: 880_000 },
    ];
    expect(scoreTask({ task: "E", workingTimeSec: 900, flights }).seconds).toBe(400);
  });
  it("an unreached target cannot be changed: a new call is ignored until it is reached", () => {
    // Target 90 missed (60); a call of 50 is ignored; the 70 s flight still attempts 90 → 0.
    const flights = [
      { launchMs: 0, landMs: 60_000, targetSec: 90 },
      { launchMs: 61_000, landMs: 131_000, targetSec: 50 },
    ];
    expect(scoreTask({ task: "E", flights }).seconds).toBe(0);
  });
  it("end of working time call: one attempt, credited its time up to the end (our reading)", () => {
    // Target 100 reached at 110; end-call; launch at 400 s, lands at 620 s (inside the
    // landing window) → 200 s counted to the end at 600 s: 100 + 200 = 300.
    const flights = [
      { launchMs: 0, landMs: 110_000, targetSec: 100 },
      { launchMs: 400_000, landMs: 620_000, endCall: true },
    ];
    expect(scoreTask({ task: "E", flights }).seconds).toBe(300);
  });
});

describe("tasks F–N", () => {
  it("F (F3K.11.6): best 3 of at most 6 launches, cap 180", () => {
    // 7 launches: 50,60,70,80,90,100, then 179 (7th, ignored). Best 3 of first 6: 100+90+80 = 270.
    expect(scoreTask({ task: "F", flights: backToBack([50, 60, 70, 80, 90, 100, 179], 500) }).seconds).toBe(270);
  });
  it("G (F3K.11.7): five longest, cap 120", () => {
    // 130→120, 110, 100, 90, 80, 70: top five 120+110+100+90+80 = 500.
    expect(scoreTask({ task: "G", flights: backToBack([130, 110, 70, 100, 90, 80], 500) }).seconds).toBe(500);
  });
  it("H (F3K.11.8): any order, four longest matched longest→240", () => {
    // 250→240, 100→180 slot: 100, 70→120 slot: 70, 65→60 slot: 60: 470.
    expect(scoreTask({ task: "H", flights: backToBack([65, 250, 70, 100]) }).seconds).toBe(470);
  });
  it("I (F3K.11.9): three longest, cap 200", () => {
    // 210→200, 150, 190: 540.
    expect(scoreTask({ task: "I", flights: backToBack([150, 210, 20, 190]) }).seconds).toBe(540);
  });
  it("J (F3K.11.10): last three, cap 180", () => {
    // 200(dropped), 181→180, 30, 100: 310.
    expect(scoreTask({ task: "J", flights: backToBack([200, 181, 30, 100]) }).seconds).toBe(310);
  });
  it("K (F3K.11.11): five launches in order against 60, 90, 120, 150, 180; a short flight counts its time", () => {
    // Five launches: 65→60, 80 (short of 90, counts 80), 125→120, 150 (= 150), 5 (short of
    // 180, counts 5) = 415; the 6th launch (100) does not count.
    const r = scoreTask({ task: "K", flights: backToBack([65, 80, 125, 150, 5, 100], 300) });
    expect(r.seconds).toBe(415);
    expect(r.flights[5]?.reason).toBe("beyond-launch-limit");
  });
  it("L (F3K.11.12): one flight, 599 s in 10 min and 419 s in 7 min", () => {
    // 10 min: launched at 0, lands at 615 s, inside the 30 s landing window (F3K.7): time counts
    // to the end of working time (600 s), then the cap of 599 s.
    // 7 min: only the first launch counts (one flight): 300 s; the second (99 s) does not.
    expect(scoreTask({ task: "L", flights: [{ launchMs: 0, landMs: 615_000 }] }).seconds).toBe(599);
    expect(scoreTask({ task: "L", workingTimeSec: 420, flights: [{ launchMs: 0, landMs: 300_000 }, { launchMs: 301_000, landMs: 400_000 }] }).seconds).toBe(300);
  });
  it("M (F3K.11.13): three launches against 180, 300, 420 in 15 min", () => {
    // 200→180, 290 (short of 300, counts 290), 380 (short of 420): 850, under the sum cap 897.
    expect(scoreTask({ task: "M", flights: backToBack([200, 290, 380], 1000) }).seconds).toBe(180 + 290 + 380);
  });
  it("N (F3K.11.14): best single flight, cap 599", () => {
    expect(scoreTask({ task: "N", flights: backToBack([100, 400.05, 50]) }).seconds).toBe(400);
  });
});
