import { z } from "zod";
import { emailSchema } from "./auth";
import { text } from "./bounds";
import { planInputSchema } from "@/lib/coach/plan-goals";

/** A pilot's offer: to a coach's e-mail address, or a one-time code the coach types in. */
export const coachOfferSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("email"), email: emailSchema }),
  z.object({ kind: z.literal("code") }),
], { message: "Offer by e-mail ({ kind: \"email\", email }) or by code ({ kind: \"code\" })." });
export type CoachOfferInput = z.infer<typeof coachOfferSchema>;

/** The code a coach types in (any case, spaces or hyphens allowed). */
export const coachClaimSchema = z.object({
  code: text(20).trim().regex(/^[A-Za-z0-9\s-]{8,20}$/, "Type the 8-character code the pilot showed you."),
});

/** A grant or offer named in a path. */
export const grantIdSchema = z.object({ grantId: z.uuid() });

/** Most characters in a note or an answer. */
export const NOTE_BODY_MAX = 2000;

const noteBody = text(NOTE_BODY_MAX).trim().min(1, "Write something first.");

/** A coach's note on one of a granting pilot's runs or sessions (exactly one of runId, sessionId). */
export const noteCreateSchema = z
  .object({ pilotId: z.uuid(), runId: z.uuid().optional(), sessionId: z.uuid().optional(), body: noteBody })
  .refine((n) => (n.runId === undefined) !== (n.sessionId === undefined), { message: "Name the run or the session the note is about (one of them)." });
export type NoteCreateInput = z.infer<typeof noteCreateSchema>;

/** An answer in a note's thread. */
export const noteReplySchema = z.object({ body: noteBody });

/** A note named in a path. */
export const noteIdSchema = z.object({ noteId: z.uuid() });

/** A practice plan the coach assigns (POST /api/coach/plans). */
export const planCreateSchema = planInputSchema.extend({ pilotId: z.uuid() });

/**
 * The coach changes a plan (PATCH /api/coach/plans/[planId]): a new title and items (the whole list,
 * as planInputSchema checks it; runs keep the item number they were set up from), and/or closes or
 * reopens it.
 */
export const planUpdateSchema = z.union([
  planInputSchema.extend({ closed: z.boolean().optional() }),
  z.object({ closed: z.boolean() }).strict(),
]);
export type PlanUpdate = z.infer<typeof planUpdateSchema>;

export const planIdParamsSchema = z.object({ planId: z.uuid() });
