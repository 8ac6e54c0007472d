import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import { taskDefinitionSchema, type TaskDefinition } from "./definition";

/**
 * A pilot's own practice task, from the same parts as the catalogue: any working time,
 * any cap, a ladder of targets flown in order or in any order, best-n / last-n / all.
 */
export const customTaskInputSchema = lazySchema(() =>
  z.object({
    name: z.string().trim().min(1, "Give the task a name.").max(80),
    workingTimeSec: z.number().int().min(30, "Working time is at least 30 s.").max(3600, "Working time is at most 60 min."),
    capSec: z.number().int().min(1).max(3600).nullable().default(null),
    targetsSec: z.array(z.number().int().min(1).max(3600)).max(12).default([]),
    order: z.enum(["in-order", "any-order"]).default("in-order"),
    counting: z.enum(["all", "best", "last"]).default("all"),
    /** How many flights count for best / last; defaults to the ladder's length. */
    count: z.number().int().min(1).max(20).optional(),
    launchLimit: z.number().int().min(1).max(50).nullable().default(null),
    sumCap: z.boolean().default(true),
  }),
);
export type CustomTaskInput = z.input<typeof customTaskInputSchema>;

/**
 * Builds and validates a custom task definition; throws a ZodError with a readable message
 * for each problem (e.g. an in-order ladder of 4 steps with a launch limit of 3).
 * An in-order ladder counting all flights gets a launch limit equal to its steps if none is set.
 */
export function buildCustomTask(input: CustomTaskInput): TaskDefinition {
  const p = customTaskInputSchema.parse(input);
  const ladder = p.targetsSec.length > 0 ? { order: p.order, targetsSec: p.targetsSec } : null;
  const n = p.count ?? (ladder ? p.targetsSec.length : 1);
  const launchLimit = ladder && p.order === "in-order" && p.counting === "all" ? (p.launchLimit ?? p.targetsSec.length) : p.launchLimit;
  return taskDefinitionSchema.parse({
    edition: "custom",
    letter: null,
    name: p.name,
    kind: "window",
    workingTimeSec: p.workingTimeSec,
    landingWindowSec: 30,
    launchLimit,
    counting: p.counting === "all" ? { rule: "all" } : { rule: p.counting, n },
    capSec: ladder ? null : p.capSec,
    ladder,
    sumCap: p.sumCap,
  });
}
