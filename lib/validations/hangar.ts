import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import { text } from "./bounds";

export const MODEL_STATUSES = ["flying", "being-repaired", "retired", "sold"] as const;

/** A model as the hangar form sends it. Span and mass are bounded far beyond any glider, not by the class limits. */
export const modelInputSchema = lazySchema(() => z.object({
  name: text(80).trim().min(1, "name the model"),
  spanMm: z.number().int().min(100, "span in millimetres").max(10_000),
  massG: z.number().int().min(10, "mass in grams").max(20_000),
  marking: text(200).trim().default(""),
  notes: text(4000).default(""),
  status: z.enum(MODEL_STATUSES).default("flying"),
}));
export type ModelInput = z.infer<typeof modelInputSchema>;

export const modelPatchSchema = lazySchema(() => modelInputSchema.partial());

export const repairInputSchema = lazySchema(() => z.object({
  repairedOn: z.iso.date("a date like 2026-06-14"),
  work: text(2000).trim().min(1, "say what was done"),
  massAfterG: z.number().int().min(10).max(20_000).nullable().default(null),
}));

export const transferInputSchema = lazySchema(() => z.object({
  email: text(254).trim().toLowerCase().pipe(z.email("an e-mail address")),
  withHistory: z.boolean(),
}));

export const modelIdSchema = lazySchema(() => z.object({ modelId: z.uuid() }));

/** The answer to a model offered to the account's address. */
export const offerAnswerSchema = lazySchema(() => z.object({ answer: z.enum(["accept", "decline"], "Answer accept or decline.") }));

export const offerIdSchema = lazySchema(() => z.object({ offerId: z.uuid() }));
