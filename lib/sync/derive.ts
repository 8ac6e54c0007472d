import { runResult } from "@/lib/results";
import type { DerivationInput, LaneDerivation } from "@/lib/results";

export type { DerivationEvent, DerivationInput, LaneDerivation, LaneDerived, LaneVersion, ReviewItem, RulingNote } from "@/lib/results";

/**
 * The server's derivation of a run's lane results (SYNC.md §1): the one function every screen
 * uses (lib/results runResult), here over every device's stored events and clock estimates.
 */
export function deriveRun(input: DerivationInput): LaneDerivation[] {
  return runResult(input).lanes;
}
