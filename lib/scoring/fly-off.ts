import type { TaskLetter } from "@/lib/tasks/definition";
import { finalStandings, rankFlyOff, type FinalPlace, type PilotEntry, type Standing } from "./ranking";

/** A fly-off has 3 to 6 rounds (F3K.10). */
export const FLY_OFF_ROUNDS = { min: 3, max: 6 } as const;

export type Stage = "preliminary" | "fly-off";

/** Task M is for fly-offs only (F3K.11.13); null when the task may be flown in this stage. */
export function roundTaskProblem(letter: TaskLetter | null, stage: Stage): string | null {
  return letter === "M" && stage !== "fly-off" ? "Task M (huge ladder) is flown in fly-off rounds only." : null;
}

/** Problems with a planned fly-off: its number of rounds (F3K.10); empty when it may be flown. */
export function flyOffPlanProblems(rounds: number): string[] {
  if (!Number.isInteger(rounds) || rounds < FLY_OFF_ROUNDS.min) return [`A fly-off has at least ${FLY_OFF_ROUNDS.min} rounds (F3K.10).`];
  if (rounds > FLY_OFF_ROUNDS.max) return [`A fly-off has at most ${FLY_OFF_ROUNDS.max} rounds (F3K.10).`];
  return [];
}

export type FinalResult = { places: FinalPlace[]; flyOffCounted: boolean };

/**
 * The final order after a fly-off (F3K.10). Each fly-off entry holds its fly-off round scores
 * and penalties only (preliminary points and penalties do not carry over); a round counts
 * once every fly-off pilot has a score in it. Fewer than 3 completed fly-off rounds:
 * the preliminary results stand. More than 6 rounds: refused (throws).
 */
export function finalResults(preliminary: readonly Standing[], flyOff: readonly PilotEntry[]): FinalResult {
  const completed = Math.min(...flyOff.map((e) => e.rounds.length));
  if (flyOff.length > 0 && Math.max(...flyOff.map((e) => e.rounds.length)) > FLY_OFF_ROUNDS.max) {
    throw new Error(`A fly-off has at most ${FLY_OFF_ROUNDS.max} rounds.`);
  }
  if (flyOff.length === 0 || completed < FLY_OFF_ROUNDS.min) {
    return { places: finalStandings(preliminary, []), flyOffCounted: false };
  }
  // A round counts once every fly-off pilot has flown it.
  const counted = flyOff.map((e) => ({ ...e, rounds: e.rounds.slice(0, completed) }));
  return { places: finalStandings(preliminary, rankFlyOff(counted)), flyOffCounted: true };
}
