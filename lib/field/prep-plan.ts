import { z } from "zod";

/**
 * The optional countdown before working time: preparation, then the no-fly minute
 * (F3K.9: a 60 s no-fly period just before each working time), then the working time
 * starts by itself. Kept on the device beside the run; the working-time start itself is
 * an event like any tap.
 */
export const prepPlanSchema = z.object({
  /** Device wall time the countdown began. */
  beganAtWallMs: z.number().finite(),
  prepSec: z.number().int().min(0).max(3600),
  noFlySec: z.number().int().min(0).max(600),
});
export type PrepPlan = z.infer<typeof prepPlanSchema>;

export type PrepStage =
  | { stage: "preparation"; leftMs: number; startsAtWallMs: number }
  | { stage: "no-fly"; leftMs: number; startsAtWallMs: number }
  | { stage: "due"; startsAtWallMs: number };

/** Where the countdown stands at `wallNow`. */
export function prepStageAt(plan: PrepPlan, wallNow: number): PrepStage {
  const noFlyAt = plan.beganAtWallMs + plan.prepSec * 1000;
  const startsAtWallMs = noFlyAt + plan.noFlySec * 1000;
  if (wallNow < noFlyAt) return { stage: "preparation", leftMs: noFlyAt - wallNow, startsAtWallMs };
  if (wallNow < startsAtWallMs) return { stage: "no-fly", leftMs: startsAtWallMs - wallNow, startsAtWallMs };
  return { stage: "due", startsAtWallMs };
}

/** The localStorage key of a run's plan. */
export const prepPlanKey = (runId: string) => `windowcall.field.prep.${runId}`;

/** Reads a stored plan; anything unreadable is no plan. */
export function parsePrepPlan(raw: string | null): PrepPlan | null {
  if (!raw) return null;
  try {
    const parsed = prepPlanSchema.safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}
