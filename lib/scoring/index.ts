/** Contest scoring: normalised group scores, totals with the drop, ranking, fly-off, teams. */
export { normaliseGroup, normaliseUnits, divideRounded, type HalfRounding } from "./normalise";
export { contestTotal, DROP_FROM_ROUNDS, MIN_VALID_ROUNDS, type ContestTotal, type ContestTotalInput } from "./total";
export { scoreRound, type GroupResult } from "./rounds";
export {
  rankPilots,
  rankFlyOff,
  finalStandings,
  rankTeams,
  type PilotEntry,
  type Standing,
  type FinalPlace,
  type TeamEntry,
  type TeamStanding,
} from "./ranking";
