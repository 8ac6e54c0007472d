import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";

/**
 * Task definitions are data. A run stores its whole definition (not only a letter),
 * tagged with its edition, because task letters and rules change between editions
 * (RULES.md "Earlier editions"). Custom practice tasks are built from the same parts.
 *
 * Three shapes cover every task of the 2025 edition:
 * - `window`: flights inside one working time, counted by a rule (last / best / all),
 *   each capped by a uniform cap or matched to a ladder of targets (A, B, D, F–N).
 * - `poker`: the pilot announces each target; the reached target is credited (E).
 * - `all-up`: one attempt per launch signal, all pilots together (C).
 *
 * Every schema here is built on first use (`lazySchema`, issue #10): building them all when the
 * module is evaluated was the longest part of /field's islands' load, before anything was parsed.
 * A new module-level schema here: wrap it too.
 */

export const taskLetterSchema = lazySchema(() =>
  z.enum(["A", "B", "C", "D", "E", "F", "G", "H", "I", "J", "K", "L", "M", "N"]),
);
export type TaskLetter = z.infer<typeof taskLetterSchema>;

export const editionSchema = lazySchema(() => z.enum(["F3K-2025", "custom"]));
export type Edition = z.infer<typeof editionSchema>;

const seconds = lazySchema(() => z.number().int().min(1).max(3600));

/** Task C: how many attempts a round may have (F3K.11.3: 3 to 5). */
export const ALL_UP_ATTEMPTS = { min: 3, max: 5 } as const;

export const countingSchema = lazySchema(() =>
  z.discriminatedUnion("rule", [
    /** Every flight counts (bounded by the launch limit or the ladder's length). */
    z.object({ rule: z.literal("all") }),
    /** The last n flights count; a new launch pushes the oldest out (A, B, J). */
    z.object({ rule: z.literal("last"), n: z.number().int().min(1).max(20) }),
    /** The n longest flights count (F, G, H, I, N). */
    z.object({ rule: z.literal("best"), n: z.number().int().min(1).max(20) }),
  ]),
);
export type Counting = z.infer<typeof countingSchema>;

export const ladderSchema = lazySchema(() =>
  z.object({
    /** in-order: flight k flies step k (K, M); any-order: longest flight ↔ longest target (H). */
    order: z.enum(["in-order", "any-order"]),
    targetsSec: z.array(seconds).min(1).max(12),
  }),
);
export type Ladder = z.infer<typeof ladderSchema>;

/**
 * How an exact half of 0.1 point rounds when results are normalised (F3K.9.1, AMBIGUOUS in the
 * rules): stored with the task so a run scores the same on every screen and in a contest.
 */
export const halfRoundingSchema = lazySchema(() => z.enum(["half-up", "half-even", "down"]));

/** The fields every shape has (a function: `letter` is built only when a shape is). */
const common = () => ({
  edition: editionSchema,
  /** The rulebook letter for catalogue tasks; null for a custom task. */
  letter: taskLetterSchema.nullable(),
  name: z.string().min(1).max(80),
  /** Absent: "half-up", our default (lib/tasks/rule-settings.ts). */
  halves: halfRoundingSchema.optional(),
});

export const windowTaskSchema = lazySchema(() =>
  z.object({
    ...common(),
    kind: z.literal("window"),
    workingTimeSec: z.number().int().min(30).max(3600),
    /** A model in the air at the end of working time must land within this (F3K.7: 30 s). */
    landingWindowSec: z.number().int().min(0).max(300),
    /** Launches beyond this many do not count; null = unlimited. */
    launchLimit: z.number().int().min(1).max(50).nullable(),
    counting: countingSchema,
    /** Uniform per-flight maximum; null with a ladder (the targets cap) or for "no cap". */
    capSec: seconds.nullable(),
    ladder: ladderSchema.nullable(),
    /** F3K.7 sum cap: total ≤ working time − 1 s per scored flight. */
    sumCap: z.boolean(),
  }),
);

export const pokerTaskSchema = lazySchema(() =>
  z.object({
    ...common(),
    kind: z.literal("poker"),
    workingTimeSec: z.number().int().min(30).max(3600),
    landingWindowSec: z.number().int().min(0).max(300),
    /** At most this many reached targets are credited (E: 3). */
    maxTargets: z.number().int().min(1).max(10),
    /**
     * What the "end of working time" call credits (AMBIGUOUS in RULES.md, see poker.ts):
     * "flown" = the flight's time up to the end of working time;
     * "airborne-at-end" = the same, but only if the model is still flying at the end.
     */
    endCall: z.enum(["flown", "airborne-at-end", "not-allowed"]),
    sumCap: z.boolean(),
  }),
);

export const allUpTaskSchema = lazySchema(() =>
  z.object({
    ...common(),
    kind: z.literal("all-up"),
    /** Task C is flown in 3 to 5 attempts (F3K.11.3). */
    attempts: z.number().int().min(ALL_UP_ATTEMPTS.min, "Task C has at least 3 attempts.").max(ALL_UP_ATTEMPTS.max, "Task C has at most 5 attempts."),
    /** A launch later than this after the signal scores zero (C: 3 s). */
    launchWindowMs: z.number().int().min(0).max(60_000),
    /** A landing later than this after the signal scores zero (C: 3:33). */
    landingDeadlineSec: z.number().int().min(1).max(3600),
    capSec: seconds,
  }),
);

export const taskDefinitionSchema = lazySchema(() =>
  z
    .discriminatedUnion("kind", [windowTaskSchema, pokerTaskSchema, allUpTaskSchema])
    .superRefine((def, ctx) => {
      if (def.kind !== "window") return;
      const issue = (message: string) => ctx.addIssue({ code: "custom", message });
      if (def.capSec !== null && def.capSec > def.workingTimeSec) issue("The cap is longer than the working time.");
      // No ladder: any cap and counting rule is allowed ("all", no cap, no limit is bounded by the sum cap).
      if (def.ladder === null) return;
      if (def.capSec !== null) issue("A ladder task takes its caps from the targets; set capSec to null.");
      const steps = def.ladder.targetsSec.length;
      if (def.ladder.targetsSec.some((t) => t > def.workingTimeSec)) issue("A target is longer than the working time.");
      if (def.ladder.order === "in-order") {
        if (def.counting.rule === "best") issue("An in-order ladder counts all or the last flights, not the best.");
        if (def.counting.rule === "all" && def.launchLimit !== steps)
          issue(`An in-order ladder counting all flights needs a launch limit of ${steps}.`);
      } else if (def.counting.rule === "all") {
        issue("An any-order ladder counts the best or the last flights.");
      }
      if (def.counting.rule !== "all" && def.counting.n !== steps)
        issue(`The ladder has ${steps} targets, so ${steps} flights must count.`);
  }),
);

export type WindowTask = z.infer<typeof windowTaskSchema>;
export type PokerTask = z.infer<typeof pokerTaskSchema>;
export type AllUpTask = z.infer<typeof allUpTaskSchema>;
export type TaskDefinition = z.infer<typeof taskDefinitionSchema>;

/** Parses a definition (catalogue or custom); throws a ZodError with readable messages. */
export function parseTaskDefinition(input: unknown): TaskDefinition {
  return taskDefinitionSchema.parse(input);
}
