/**
 * A contest's set-up checked against the rules. A valid contest has at least 5 rounds, each with a
 * different task (F3K.10); task M is for fly-offs only (F3K.11, F3K.10); preparation time is at
 * least 5 minutes and a 60 s no-fly period comes before each working time (F3K.9). For an official
 * contest a breach is an error; a practice event may break the round and timing rules with a
 * warning (club evenings fly 3 rounds of their favourite task). Task M outside a fly-off is an
 * error either way: no valid round can be built on it. A planned fly-off has 3 to 6 rounds (F3K.10)
 * and says how many pilots fly it (RULES.md leaves that to the organiser).
 */
import { flyOffPlanProblems } from "@/lib/scoring/fly-off";
import { MAX_FLY_OFF_PILOTS, MIN_FLY_OFF_PILOTS } from "./fly-off-draw";

export type RoundPlan = { letter: string; flyOff?: boolean };
/** `flyOffPilots`: how many pilots of the preliminary order fly the fly-off (the rules leave it to the organiser). */
export type SetupPlan = { rounds: RoundPlan[]; practice: boolean; prepMinutes: number; noFlySeconds: number; flyOffPilots?: number | null };
export type SetupCheck = { errors: string[]; warnings: string[] };

export const MIN_ROUNDS = 5;

export function checkSetup(plan: SetupPlan): SetupCheck {
  const errors: string[] = [];
  const soft: string[] = [];
  const main = plan.rounds.filter((r) => !r.flyOff);
  main.forEach((r, i) => {
    if (r.letter === "M") errors.push(`Round ${i + 1}: task M is for fly-off rounds only (F3K.10).`);
  });
  const flyOffRounds = plan.rounds.length - main.length;
  if (flyOffRounds > 0) errors.push(...flyOffPlanProblems(flyOffRounds));
  if (flyOffRounds > 0 && plan.flyOffPilots !== undefined) {
    const n = plan.flyOffPilots;
    if (n === null || !Number.isInteger(n) || n < MIN_FLY_OFF_PILOTS || n > MAX_FLY_OFF_PILOTS) {
      errors.push(`Give how many pilots fly the fly-off: ${MIN_FLY_OFF_PILOTS} to ${MAX_FLY_OFF_PILOTS}.`);
    }
  }
  if (main.length < MIN_ROUNDS) soft.push(`A valid contest has at least ${MIN_ROUNDS} rounds (F3K.10); this one has ${main.length}.`);
  const seen = new Map<string, number>();
  main.forEach((r, i) => {
    const first = seen.get(r.letter);
    if (first !== undefined) soft.push(`Round ${i + 1} repeats task ${r.letter} of round ${first + 1}; a valid contest flies a different task each round (F3K.10).`);
    else seen.set(r.letter, i);
  });
  if (plan.prepMinutes < 5) soft.push("Preparation time is at least 5 minutes (F3K.9).");
  if (plan.noFlySeconds < 60) soft.push("A no-fly period of 60 s comes before each working time (F3K.9).");
  return plan.practice ? { errors, warnings: soft } : { errors: [...errors, ...soft], warnings: [] };
}
