import { describe, expect, it } from "vitest";
import { itemProgress, nextPlanItem, median, planInputSchema, planProgress, progressText, type PlanItem, type PlanRun } from "@/lib/coach/plan-goals";

// Hand-computed examples. A run's turnarounds come as the Season counts them (lane_flights.ground_ms
// through db/queries/season/turnaround.ts, checked in tests/integration/season-aggregates.test.ts:
// a landing at 1:00.0 and the next launch at 1:02.4 make 2.4 s); here they are given in seconds.
const turnaroundItem: Pick<PlanItem, "windows" | "measure"> = { windows: 3, measure: { kind: "median-turnaround-below", seconds: 3 } };

function run(item: number, groundSec: number[], resultTenths: number | null = 1000, maxTenths: number | null = 6000): PlanRun {
  return { item, resultTenths, maxTenths, groundMs: groundSec.map((s) => Math.round(s * 1000)) };
}

describe("practice plan goals", () => {
  it("median of odd and even counts", () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([])).toBeNull();
  });

  it("three 1-2-3-4 windows with median turnaround under 3 s: met with 2.4, 2.8, 3.6, 2.0, 5.0 s", () => {
    // window 1: ground 2.4 s and 2.8 s; window 2: 3.6 s; window 3: 2.0 s and 5.0 s
    // sorted: 2.0 2.4 2.8 3.6 5.0 → median 2.8 s < 3 s
    const runs = [run(0, [2.4, 2.8]), run(0, [3.6]), run(0, [2, 5])];
    const p = itemProgress(turnaroundItem, runs);
    expect(p.flown).toBe(3);
    expect(p.value).toBeCloseTo(2.8, 9);
    expect(p.met).toBe(true);
    expect(progressText(turnaroundItem, p)).toBe("3 of 3 windows flown · median turnaround 2.8 s (goal: under 3 s) · goal met");
  });

  it("the number reached in too few windows is not met; a median of exactly 3 s is not under 3 s", () => {
    const two = [run(0, [2]), run(0, [1])];
    expect(itemProgress(turnaroundItem, two)).toEqual({ flown: 2, windows: 3, value: 1.5, met: false });
    const three = [run(0, [3]), run(0, [3]), run(0, [3])];
    expect(itemProgress(turnaroundItem, three)).toMatchObject({ flown: 3, value: 3, met: false });
  });

  it("a window without a result does not count as flown nor measured", () => {
    const runs = [run(0, [1], null)];
    expect(itemProgress({ windows: 1, measure: null }, runs)).toEqual({ flown: 0, windows: 1, value: null, met: false });
  });

  it("median share of the maximum: 450/600, 300/600 and 540/600 → 75 %", () => {
    const item: Pick<PlanItem, "windows" | "measure"> = { windows: 2, measure: { kind: "median-share-at-least", percent: 75 } };
    const runs = [run(1, [], 4500, 6000), run(1, [], 3000, 6000), run(1, [], 5400, 6000)];
    expect(itemProgress(item, runs)).toEqual({ flown: 3, windows: 2, value: 75, met: true });
    expect(itemProgress({ ...item, measure: { kind: "median-share-at-least", percent: 76 } }, runs).met).toBe(false);
  });

  it("a plan is done when every item is met; runs count only for the item they name", () => {
    const items = [turnaroundItem, { windows: 1, measure: null }];
    const runs = [run(1, [])];
    const p = planProgress(items, runs);
    expect(p.items.map((i) => i.flown)).toEqual([0, 1]);
    expect(p.done).toBe(false);
    expect(planProgress([{ windows: 1, measure: null }], [run(0, [])]).done).toBe(true);
  });

  it("the next item to fly is the first not met, in the coach's order; none when all are met or the plan is closed", () => {
    const met = { flown: 3, windows: 3, value: 2, met: true };
    const open = { flown: 1, windows: 3, value: 2, met: false };
    const items = [{}, {}, {}];
    expect(nextPlanItem({ items, progress: { items: [met, open, open], done: false } })).toBe(1);
    expect(nextPlanItem({ items, progress: { items: [open, met, open], done: false } })).toBe(0);
    // an item without progress yet (e.g. just added by the coach) is not met
    expect(nextPlanItem({ items, progress: { items: [met, met], done: false } })).toBe(2);
    expect(nextPlanItem({ items, progress: { items: [met, met, met], done: true } })).toBeNull();
    expect(nextPlanItem({ items, progress: { items: [open, open, open], done: false }, closedAtMs: 1 })).toBeNull();
  });

  it("plan input: catalogue variants only, bounded goal", () => {
    const ok = { title: "Turnarounds", items: [{ letter: "H", variant: 600, goal: "three 1-2-3-4 windows", windows: 3, measure: { kind: "median-turnaround-below", seconds: 3 } }] };
    expect(planInputSchema.safeParse(ok).success).toBe(true);
    expect(planInputSchema.safeParse({ ...ok, items: [{ ...ok.items[0], variant: 420 }] }).success).toBe(false);
    expect(planInputSchema.safeParse({ ...ok, items: [{ ...ok.items[0], goal: "x".repeat(201) }] }).success).toBe(false);
    expect(planInputSchema.safeParse({ ...ok, items: [] }).success).toBe(false);
  });
});

describe("the coach's plan form", async () => {
  const { planFormSchema, planFromForm, planToForm } = await import("@/lib/coach/plan-form");
  it("a stored plan opens in the form for editing and comes back unchanged", () => {
    const plan = { pilotId: "p", title: "Relaunches", items: [
      { letter: "H" as const, variant: 600, goal: "three 1-2-3-4 windows", windows: 3, measure: { kind: "median-turnaround-below" as const, seconds: 2.5 } },
      { letter: "A" as const, variant: 420, goal: "two last-flight windows", windows: 2, measure: { kind: "median-share-at-least" as const, percent: 80 } },
      { letter: "C" as const, variant: 3, goal: "calm launches", windows: 1, measure: null },
    ] };
    const form = planToForm(plan);
    expect(planFormSchema.safeParse(form).success).toBe(true);
    expect(planFromForm(form)).toEqual(plan);
  });
  it("turns the inputs into the route's plan and refuses a missing number", () => {
    const form = { pilotId: "p", title: " Turnarounds ", items: [{ task: "H:600", goal: "three 1-2-3-4 windows", windows: "3", measure: "median-turnaround-below" as const, target: "3" }] };
    expect(planFormSchema.safeParse(form).success).toBe(true);
    expect(planFromForm(form)).toEqual({
      pilotId: "p", title: "Turnarounds",
      items: [{ letter: "H", variant: 600, goal: "three 1-2-3-4 windows", windows: 3, measure: { kind: "median-turnaround-below", seconds: 3 } }],
    });
    expect(planInputSchema.safeParse(planFromForm(form)).success).toBe(true);
    expect(planFormSchema.safeParse({ ...form, items: [{ ...form.items[0], target: "" }] }).success).toBe(false);
    expect(planFromForm({ ...form, items: [{ ...form.items[0]!, measure: "none" as const }] }).items[0]!.measure).toBeNull();
  });
});
