import { z } from "zod";
import { emailSchema } from "./auth";
import { text } from "./bounds";

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
