import { z } from "zod";
import { PLAN_GOAL_MAX, PLAN_ITEMS_MAX, PLAN_TITLE_MAX, PLAN_WINDOWS_MAX, type PlanInput, type PlanItem } from "./plan-goals";
import { taskLetterSchema } from "@/lib/tasks";

/**
 * What the coach's plan builder collects (strings from the inputs) and its conversion into the
 * route's planInputSchema shape; the server parses that again.
 */
const number = (msg: string) => z.string().trim().min(1, msg).refine((s) => Number.isFinite(Number(s)), msg);

export const planFormSchema = z.object({
  pilotId: z.string().min(1, "Choose the pilot."),
  title: z.string().trim().min(1, "Give the plan a title.").max(PLAN_TITLE_MAX, `Keep the title to ${PLAN_TITLE_MAX} characters.`),
  items: z.array(z.object({
    task: z.string().regex(/^[A-N]:\d+$/, "Choose a task."),
    goal: z.string().trim().min(1, "Say the goal in a few words.").max(PLAN_GOAL_MAX, `Keep the goal to ${PLAN_GOAL_MAX} characters.`),
    windows: number("How many windows (1 to 20)?").refine((s) => Number.isInteger(Number(s)) && Number(s) >= 1 && Number(s) <= PLAN_WINDOWS_MAX, "How many windows (1 to 20)?"),
    measure: z.enum(["none", "median-turnaround-below", "median-share-at-least"]),
    target: z.string(),
  }).refine((i) => i.measure === "none" || (Number.isFinite(Number(i.target)) && i.target.trim() !== "" && Number(i.target) > 0 && Number(i.target) <= (i.measure === "median-share-at-least" ? 100 : 600)), {
    message: "Give the number to reach (seconds up to 600, or a percentage up to 100).", path: ["target"],
  })).min(1, "Add at least one item.").max(PLAN_ITEMS_MAX, `A plan holds at most ${PLAN_ITEMS_MAX} items.`),
});
export type PlanForm = z.infer<typeof planFormSchema>;

export const EMPTY_ITEM: PlanForm["items"][number] = { task: "H:600", goal: "", windows: "3", measure: "median-turnaround-below", target: "3" };

/** The form's values as the route takes them. */
export function planFromForm(f: PlanForm): PlanInput & { pilotId: string } {
  return {
    pilotId: f.pilotId,
    title: f.title.trim(),
    items: f.items.map((i) => {
      const [letter, variant] = i.task.split(":");
      const target = Number(i.target);
      return {
        letter: taskLetterSchema.parse(letter),
        variant: Number(variant),
        goal: i.goal.trim(),
        windows: Number(i.windows),
        measure: i.measure === "none" ? null : i.measure === "median-turnaround-below" ? { kind: i.measure, seconds: target } : { kind: i.measure, percent: target },
      };
    }),
  };
}

/** A stored plan as the form's values, for the coach to edit it (the inverse of planFromForm). */
export function planToForm(plan: { pilotId: string; title: string; items: readonly PlanItem[] }): PlanForm {
  return {
    pilotId: plan.pilotId,
    title: plan.title,
    items: plan.items.map((i) => ({
      task: `${i.letter}:${i.variant}`,
      goal: i.goal,
      windows: String(i.windows),
      measure: i.measure?.kind ?? "none",
      target: i.measure === null ? "" : String(i.measure.kind === "median-turnaround-below" ? i.measure.seconds : i.measure.percent),
    })),
  };
}
