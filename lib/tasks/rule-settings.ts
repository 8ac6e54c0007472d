import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import { halfRoundingSchema, pokerTaskSchema, type TaskDefinition } from "./definition";

/**
 * The choices the rules leave open (README "Choices"), set where a window is set up and
 * stored in the run's task definition, so the same run scores the same everywhere and a
 * contest can carry them in its tasks too.
 * - `halves`: how an exact half of 0.1 point rounds in normalised scores (F3K.9.1 does not say);
 * - `endCall`: what task E's "end of working time" call credits (F3K.11.5 does not say).
 */
export const ruleSettingsSchema = lazySchema(() =>
  z.object({
    halves: halfRoundingSchema,
    endCall: pokerTaskSchema.shape.endCall,
  }),
);
export type RuleSettings = z.infer<typeof ruleSettingsSchema>;

/** Ours, where the rules are silent: halves round up (in the pilot's favour); the end call credits the time flown. */
export const DEFAULT_RULE_SETTINGS: RuleSettings = { halves: "half-up", endCall: "flown" };

/** The settings a stored definition carries (defaults for what it does not say). */
export function ruleSettingsOf(def: TaskDefinition): RuleSettings {
  return {
    halves: def.halves ?? DEFAULT_RULE_SETTINGS.halves,
    endCall: def.kind === "poker" ? def.endCall : DEFAULT_RULE_SETTINGS.endCall,
  };
}

/** A copy of `def` with the settings applied (the end call only to a task E / poker task). */
export function withRuleSettings(def: TaskDefinition, settings: RuleSettings): TaskDefinition {
  const s = ruleSettingsSchema.parse(settings);
  const copy = { ...structuredClone(def), halves: s.halves };
  return copy.kind === "poker" ? { ...copy, endCall: s.endCall } : copy;
}

/** Plain words for each choice, for forms and the run page. */
export const HALVES_LABEL: Record<RuleSettings["halves"], string> = {
  "half-up": "Exact halves round up",
  "half-even": "Exact halves round to even",
  down: "Always round down",
};
export const END_CALL_LABEL: Record<RuleSettings["endCall"], string> = {
  flown: "The flight's time up to the end of working time",
  "airborne-at-end": "Its time only if still flying at the end",
  "not-allowed": "No end-of-working-time call",
};
