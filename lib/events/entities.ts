import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import { epochMs, jsonProblem, text } from "./bounds";

/**
 * Field sessions and runs: created on a device, stored there (lib/offline/db.ts), pushed to the
 * server and pulled back. Part of the sync contract with lib/events/schema.ts: plain zod, no
 * browser or server code, imported by both sides.
 */

const userId = text(64).min(1);

/** Bounds of a run's stored task JSON (a catalogue task is about 300 bytes). */
export const TASK_LIMITS = { maxBytes: 8192, maxDepth: 6 } as const;

/** One outing to a field: where, when, in what conditions. */
export const sessionEntitySchema = lazySchema(() => z.object({
  id: z.uuid(), // UUIDv7, client-generated
  ownerId: userId,
  fieldName: text(120).trim().min(1),
  position: z.object({ lat: z.number().min(-90).max(90), lon: z.number().min(-180).max(180) }).optional(),
  conditions: z.object({
    windMs: z.number().min(0).max(60).optional(),
    gustMs: z.number().min(0).max(80).optional(),
    temperatureC: z.number().min(-50).max(60).optional(),
    notes: text(2000).optional(),
  }),
  /** Device wall clock when the session started (ms since the Unix epoch). */
  startedAtWallMs: epochMs,
  clubId: text(64).min(1).optional(),
}));
export type SessionEntity = z.infer<typeof sessionEntitySchema>;

/** One pilot's lane in a run. */
export const runLaneSchema = lazySchema(() => z.object({
  lane: z.number().int().min(0).max(3),
  pilotName: text(120).trim().min(1),
  pilotUserId: userId.optional(),
}));
export type RunLane = z.infer<typeof runLaneSchema>;

/** One task window timed on the line, for 1–4 pilots (see lib/events/schema.ts). */
export const runEntitySchema = lazySchema(() => z.object({
  id: z.uuid(), // UUIDv7, client-generated
  sessionId: z.uuid(),
  /**
   * The task definition as stored JSON; its shape belongs to lib/tasks (the server parses it
   * with taskDefinitionSchema and stores only that), bounded here in size, depth and text.
   */
  task: z.record(z.string(), z.unknown()).superRefine((task, ctx) => {
    const problem = jsonProblem(task, TASK_LIMITS);
    if (problem) ctx.addIssue({ code: "custom", message: `The task ${problem}.` });
  }),
  lanes: z
    .array(runLaneSchema)
    .min(1)
    .max(4)
    .refine((lanes) => new Set(lanes.map((l) => l.lane)).size === lanes.length, "lane numbers must be unique"),
  /** Device wall clock when the run was created. */
  createdAtWallMs: epochMs,
  /**
   * The item of a practice plan assigned to the run's creator that this window was set up from
   * (lib/coach/plan-goals.ts). The server keeps it only when the plan is the creator's own.
   */
  plan: z.object({ id: z.uuid(), item: z.number().int().min(0).max(11) }).optional(),
  /**
   * A contest round this window times, set up from a timekeeper's duty (lib/contests/timekeepers.ts
   * dutyLanes): which lane times which entry. The server links each lane to the pilot's slot when the
   * pushing account is that slot's assigned timekeeper, and ignores it otherwise. With `reflightId` (a
   * re-flight's duty) the lane goes to that re-flight grant instead, when the pushing account is its
   * timekeeper; phones from before re-flight duties send no `reflightId`.
   */
  contest: z.object({
    roundId: z.uuid(),
    slots: z.array(z.object({ lane: z.number().int().min(0).max(3), entryId: z.uuid() })).min(1).max(4),
    reflightId: z.uuid().optional(),
  }).optional(),
}));
export type RunEntity = z.infer<typeof runEntitySchema>;

/**
 * "Delete this window": sent by the phone of the account that set up a run that was never
 * started (lib/offline/discard.ts). The server deletes the run unless it has a start or a launch
 * that counts (lib/results wasStarted, the same rule the phone applies), and phones that pulled
 * it drop it at their next pull.
 */
export const runDiscardSchema = lazySchema(() => z.object({ id: z.uuid() }));
export type RunDiscard = z.infer<typeof runDiscardSchema>;
