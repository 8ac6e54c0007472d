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
export { finalResults, flyOffPlanProblems, roundTaskProblem, FLY_OFF_ROUNDS, type FinalResult, type Stage } from "./fly-off";
export { reflightPlacements, standingResult, type StandingInput } from "./reflight";
