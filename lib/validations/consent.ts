import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import { CONSENT_REASON_MAX } from "@/lib/sync/consent";
import { text } from "./bounds";

/**
 * Runs recorded for someone else (lib/sync/consent.ts): the pilot's decision on one lane, and
 * each lane's standing as the pull carries it to the phones.
 */

// POST /api/runs/[runId]/lanes/[lane]/consent — path
export const laneConsentParamsSchema = lazySchema(() => z.object({
  runId: z.uuid(),
  lane: z.coerce.number().int().min(0).max(3),
}));

// POST /api/runs/[runId]/lanes/[lane]/consent — body
export const laneConsentRequestSchema = lazySchema(() => z
  .object({
    /** "pending" takes the pilot's decision back (un-hides a hidden run): the lane waits for a decision again. */
    decision: z.enum(["accepted", "disputed", "hidden", "pending"]),
    /** Why the pilot disputes it, for the recorder (required for a dispute, ignored otherwise). */
    reason: text(CONSENT_REASON_MAX)
      .transform((s) => s.trim())
      .optional(),
  })
  .refine((b) => b.decision !== "disputed" || (b.reason !== undefined && b.reason.length > 0), {
    message: "Say briefly what is wrong with the record, for the person who recorded it.",
    path: ["reason"],
  }));
export type LaneConsentRequest = z.infer<typeof laneConsentRequestSchema>;

/** One lane's standing in its pilot's record, as the pull and the consent route answer it. */
export const laneConsentSchema = lazySchema(() => z.object({
  lane: z.number().int().min(0).max(3),
  status: z.enum(["own", "pending", "accepted", "disputed", "hidden"]),
  reason: z.string().max(CONSENT_REASON_MAX).nullable(),
}));
export type LaneConsent = z.infer<typeof laneConsentSchema>;

/** Who created a run (its recorder), by name, so a pilot's logbook can say "recorded by …". */
export const recorderSchema = lazySchema(() => z.object({ id: z.string().max(64), name: z.string().max(200) }));

/** The dispute form on the phone: the reason the recorder will read. */
export const disputeFormSchema = lazySchema(() => z.object({
  reason: z.string().trim().min(1, "Say briefly what is wrong with the record.").max(CONSENT_REASON_MAX, `Keep it under ${CONSENT_REASON_MAX} characters.`),
}));
export type DisputeForm = z.infer<typeof disputeFormSchema>;
