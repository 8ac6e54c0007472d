import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import { text } from "@/lib/events/bounds";
import { median } from "@/lib/hangar/stats";
import { listVariants, taskLetterSchema, type TaskLetter } from "@/lib/tasks";

/**
 * Practice plans a coach assigns (db/schema/coaching.ts practice_plans): each item is a task from
 * the engine's catalogue, a goal in words, how many windows to fly, and — where the goal can be
 * measured — a number to reach. Progress is a pure function of the runs set up from the item
 * (their results as lib/results derived them, and their turnarounds as the Season counts them:
 * db/queries/season/turnaround.ts — one definition, not a copy here): no framework, no database.
 */

export const PLAN_TITLE_MAX = 80;
export const PLAN_ITEMS_MAX = 12;
export const PLAN_GOAL_MAX = 200;
export const PLAN_WINDOWS_MAX = 20;

/** What can be measured, and the number it is held to. */
export const planMeasureSchema = lazySchema(() => z.discriminatedUnion("kind", [
  /** Median ground time from a landing to the next launch in the same window, under `seconds`. */
  z.object({ kind: z.literal("median-turnaround-below"), seconds: z.number().min(0.5).max(600) }),
  /** Median result as a share of the task's maximum, at least `percent`. */
  z.object({ kind: z.literal("median-share-at-least"), percent: z.number().min(1).max(100) }),
]));
export type PlanMeasure = z.infer<typeof planMeasureSchema>;

export const planItemSchema = lazySchema(() => z
  .object({
    letter: taskLetterSchema,
    /** The catalogue variant: working time in seconds (task C: attempts). */
    variant: z.number().int().min(1).max(3600),
    goal: text(PLAN_GOAL_MAX).trim().min(1, "Say the goal in a few words."),
    /** How many windows of this task the plan asks for. */
    windows: z.number().int().min(1).max(PLAN_WINDOWS_MAX),
    measure: planMeasureSchema.nullable(),
  })
  .refine((i) => listVariants(i.letter).includes(i.variant), { message: "That task has no such working time.", path: ["variant"] }));
export type PlanItem = z.infer<typeof planItemSchema>;

export const planInputSchema = lazySchema(() => z.object({
  title: text(PLAN_TITLE_MAX).trim().min(1, "Give the plan a title."),
  items: z.array(planItemSchema).min(1, "Add at least one item.").max(PLAN_ITEMS_MAX, `A plan holds at most ${PLAN_ITEMS_MAX} items.`),
}));
export type PlanInput = z.infer<typeof planInputSchema>;

/** One run set up from a plan item, as derived (lib/results runResult, through the stored lane). */
export type PlanRun = {
  item: number;
  /** the pilot's lane result in tenths of a second; null when the window has no result yet */
  resultTenths: number | null;
  /** the task's maximum in tenths (the breakdown's maxTenths); null when unknown */
  maxTenths: number | null;
  /**
   * the lane's turnarounds in ms, in flight order: the ground times the Season counts
   * (db/queries/season/turnaround.ts over lane_flights.ground_ms), never worked out a second way here
   */
  groundMs: number[];
};

export type ItemProgress = {
  /** windows of this item with a result */
  flown: number;
  windows: number;
  /** the measured value (seconds for turnaround, percent for share); null when nothing to measure yet or no measure */
  value: number | null;
  /** every window flown and, where measured, the number reached */
  met: boolean;
};

export type PlanProgress = { items: ItemProgress[]; done: boolean };

/** The median of a list (the mean of the two middle values for an even count); null when empty — the hangar's, not a second copy. */
export { median };

/** The measured value of `measure` over the runs of one item. */
export function measureValue(measure: PlanMeasure, runs: readonly PlanRun[]): number | null {
  const scored = runs.filter((r) => r.resultTenths !== null);
  if (measure.kind === "median-turnaround-below") return median(scored.flatMap((r) => r.groundMs.map((ms) => ms / 1000)));
  return median(scored.filter((r) => r.maxTenths !== null && r.maxTenths > 0).map((r) => (100 * r.resultTenths!) / r.maxTenths!));
}

/** Whether `value` reaches the measure's number (a turnaround strictly under it, a share at or above it). */
export function reaches(measure: PlanMeasure, value: number | null): boolean {
  if (value === null) return false;
  return measure.kind === "median-turnaround-below" ? value < measure.seconds : value >= measure.percent;
}

/** Progress of one item from the runs set up from it. */
export function itemProgress(item: Pick<PlanItem, "windows" | "measure">, runs: readonly PlanRun[]): ItemProgress {
  const flown = runs.filter((r) => r.resultTenths !== null).length;
  const value = item.measure ? measureValue(item.measure, runs) : null;
  const met = flown >= item.windows && (item.measure === null || reaches(item.measure, value));
  return { flown, windows: item.windows, value, met };
}

/** Progress of a whole plan: each item from the runs naming it; done when every item is met. */
export function planProgress(items: readonly Pick<PlanItem, "windows" | "measure">[], runs: readonly PlanRun[]): PlanProgress {
  const out = items.map((item, i) => itemProgress(item, runs.filter((r) => r.item === i)));
  return { items: out, done: out.length > 0 && out.every((p) => p.met) };
}

/**
 * The item to fly next: the first one whose goal is not met yet (its windows not all flown, or its
 * number not reached), in the coach's order; null when every item is met or the plan is closed.
 */
export function nextPlanItem(plan: { items: readonly unknown[]; progress: PlanProgress; closedAtMs?: number | null }): number | null {
  if (plan.closedAtMs != null) return null;
  const i = plan.items.findIndex((_, k) => !plan.progress.items[k]?.met);
  return i < 0 ? null : i;
}

/** The measured value in words, e.g. "2.4 s" or "83 %". */
export function valueText(m: PlanMeasure, value: number | null): string {
  if (value === null) return "not measured yet";
  return m.kind === "median-turnaround-below" ? `${value.toFixed(1)} s` : `${Math.round(value)} %`;
}

/** One line of progress: "2 of 3 windows · median turnaround 2.4 s (goal: under 3 s) · met". */
export function progressText(item: Pick<PlanItem, "measure">, p: ItemProgress): string {
  const parts = [`${p.flown} of ${p.windows} window${p.windows === 1 ? "" : "s"} flown`];
  if (item.measure) parts.push(`${item.measure.kind === "median-turnaround-below" ? "median turnaround" : "median result"} ${valueText(item.measure, p.value)} (goal: ${item.measure.kind === "median-turnaround-below" ? `under ${item.measure.seconds} s` : `at least ${item.measure.percent} %`})`);
  parts.push(p.met ? "goal met" : "not met yet");
  return parts.join(" · ");
}

/** "Task H (10 min)" / "Task C (3 attempts)". */
export function itemTaskText(item: { letter: TaskLetter; variant: number }): string {
  return item.letter === "C" ? `Task C (${item.variant} attempts)` : `Task ${item.letter} (${Math.round(item.variant / 60)} min)`;
}
