import { z } from "zod";
import { taskDefinitionSchema, type TaskDefinition, type TaskLetter } from "@/lib/tasks";

/**
 * Pilot-owned practice plans kept on the device: a titled list of tasks flown one after
 * another over several sessions. (Coach-assigned plans and their sync come later.)
 */

export const PLAN_TITLE_MAX = 80;
export const PLAN_ITEMS_MAX = 12;

/** What the editor collects: a title and 1–12 task definitions. */
export const planDraftSchema = z.object({
  title: z
    .string()
    .trim()
    .min(1, "Give the plan a title.")
    .max(PLAN_TITLE_MAX, `Keep the title to ${PLAN_TITLE_MAX} characters or fewer.`),
  items: z
    .array(taskDefinitionSchema)
    .min(1, "Add at least one task to the plan.")
    .max(PLAN_ITEMS_MAX, `A plan holds at most ${PLAN_ITEMS_MAX} tasks.`),
});
export type PlanDraft = z.infer<typeof planDraftSchema>;

/** A plan as stored in the device's `plans` table. */
export const practicePlanSchema = planDraftSchema.extend({
  id: z.uuid(), // UUIDv7, client-generated
  createdAtWallMs: z.number().int().nonnegative(),
});
export type PracticePlan = z.infer<typeof practicePlanSchema>;

/** Per-plan progress as kept in localStorage: the index of the item to fly next. */
export const planProgressSchema = z.object({ planId: z.string().min(1), itemIndex: z.number().int().nonnegative() });
export type PlanProgress = z.infer<typeof planProgressSchema>;

/** The localStorage key of one plan's progress. */
export function planProgressKey(planId: string): string {
  return `windowcall.field.plan-progress.${planId}`;
}

/**
 * The item to fly after `runsStartedFromPlan` windows were set up along the plan's order;
 * after the last item the plan starts over (a practice plan is repeated, not finished).
 */
export function nextItemIndex(plan: Pick<PracticePlan, "items">, runsStartedFromPlan: number): number {
  const n = plan.items.length;
  if (n === 0) return 0;
  const started = Math.max(0, Math.trunc(runsStartedFromPlan));
  return started % n;
}

/**
 * Reads stored progress for `plan` (raw localStorage text); anything missing, malformed or
 * for another plan means "start at the first item", and an index past a shortened plan wraps.
 */
export function readPlanProgress(plan: Pick<PracticePlan, "id" | "items">, raw: string | null): number {
  if (!raw) return 0;
  let parsed: unknown;
  try {
    parsed = JSON.parse(raw);
  } catch {
    return 0;
  }
  const p = planProgressSchema.safeParse(parsed);
  if (!p.success || p.data.planId !== plan.id) return 0;
  return nextItemIndex(plan, p.data.itemIndex);
}

/** The progress to store once a window was set up from item `itemIndex`: the one after it is next. */
export function progressAfter(plan: Pick<PracticePlan, "id" | "items">, itemIndex: number): PlanProgress {
  return { planId: plan.id, itemIndex: nextItemIndex(plan, itemIndex + 1) };
}

/** The catalogue choice a plan item stands for, or null for a task without a rulebook letter. */
export function catalogueChoiceOf(def: TaskDefinition): { letter: TaskLetter; variant: number } | null {
  if (def.letter === null) return null;
  return { letter: def.letter, variant: def.kind === "all-up" ? def.attempts : def.workingTimeSec };
}

/** The plan's problems as one message per field, for the editor. */
export function planDraftErrors(draft: { title: string; items: TaskDefinition[] }): { title?: string; items?: string } | null {
  const out = planDraftSchema.safeParse(draft);
  if (out.success) return null;
  const errors: { title?: string; items?: string } = {};
  for (const issue of out.error.issues) {
    const field = issue.path[0] === "title" ? "title" : "items";
    errors[field] ??= issue.message;
  }
  return errors;
}
