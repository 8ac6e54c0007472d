import type { ReflightPlacement } from "@/lib/events/schema";

/**
 * Re-flights (F3K.9.6). Where a re-flight is flown decides which result stands:
 * - "later-group": the re-flyer joins a later group of the round;
 * - "new-group": a new group of at least 4 re-flyers, filled up by draw;
 * - "original-group": the original group flies again at the end of the round (the only
 *   choice in a fly-off).
 * In the last two the re-flight's result stands for the re-flyer even if worse, and the
 * others of that group, who fly again without being entitled, keep the better of their two.
 * Our reading: in a later group the re-flyer keeps the better of the two results (the rules
 * say "even if worse" only of the other two placements).
 */

/** The placements to try, in the rules' order of preference (F3K.9.6); a fly-off has only one. */
export function reflightPlacements(stage: "preliminary" | "fly-off"): readonly ReflightPlacement[] {
  return stage === "fly-off" ? ["original-group"] : ["later-group", "new-group", "original-group"];
}

export type StandingInput = {
  /** Round points (or results) of the first flight and of the re-flight. */
  original: number;
  reflight: number;
  placement: ReflightPlacement;
  /** True for the pilot granted the re-flight; false for a group mate who flies again with them. */
  entitled: boolean;
};

export type Standing = { points: number; stands: "original" | "reflight" };

/** Which of the two results stands for one pilot (F3K.9.6). */
export function standingResult({ original, reflight, placement, entitled }: StandingInput): Standing {
  const reflightEvenIfWorse = entitled && placement !== "later-group";
  if (reflightEvenIfWorse || reflight > original) return { points: reflight, stands: "reflight" };
  return { points: original, stands: "original" };
}
