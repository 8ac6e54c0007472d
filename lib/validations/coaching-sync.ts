import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import { planItemSchema } from "@/lib/coach/plan-goals";

/**
 * Notes and assigned practice plans as a pull carries them (pullReplySchema.notes / .plans): whole
 * lists on the last page of every pull, so what the user may no longer see (a revoked grant)
 * drops off the phone at its next pull.
 */

export const pulledNoteSchema = lazySchema(() => z.object({
  id: z.uuid(),
  pilotId: z.uuid(),
  coachId: z.uuid(),
  authorId: z.uuid(),
  authorName: z.string().max(500),
  sessionId: z.uuid(),
  runId: z.uuid().nullable(),
  replyTo: z.uuid().nullable(),
  body: z.string().max(4000),
  createdAtMs: z.number().int(),
}));
export type PulledNote = z.infer<typeof pulledNoteSchema>;

export const itemProgressSchema = lazySchema(() => z.object({ flown: z.number().int(), windows: z.number().int(), value: z.number().nullable(), met: z.boolean() }));

export const pulledPlanSchema = lazySchema(() => z.object({
  id: z.uuid(),
  pilotId: z.uuid(),
  pilotName: z.string().max(500),
  coachName: z.string().max(500).nullable(),
  title: z.string().max(200),
  items: z.array(planItemSchema).max(12),
  createdAtMs: z.number().int(),
  /** when the coach last edited it; null: never (older servers leave it out) */
  updatedAtMs: z.number().int().nullable().default(null),
  /** when the coach closed it: no longer "Ready to fly"; null while open */
  closedAtMs: z.number().int().nullable().default(null),
  /** the progress is as of the pilot's last push (their devices' latest); null when they never synced */
  pilotSyncedAtMs: z.number().int().nullable().default(null),
  progress: z.object({ items: z.array(itemProgressSchema), done: z.boolean() }),
}));
export type PulledPlan = z.infer<typeof pulledPlanSchema>;
