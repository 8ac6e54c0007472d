/**
 * The F3K task engine: pure TypeScript, no framework imports, the same code in the
 * browser (live score) and on the server (official score).
 */
export { scoreTask, type FlightInput, type ScoreTaskInput, type ScoreTaskResult } from "./score-task";
export { foldRun, type FoldedRun } from "./fold";
export { liveState, type LiveState, type LaneLive, type LiveFlight } from "./live";
export { phaseOf, type Phase, type RunClock } from "./run-clock";
export { pointsLost, type PointsLost } from "./breakdown";
export type { LengthHint } from "./hints";
export { applyPenaltyRules, type PenaltyVerdict, type PenaltyOutcome, type RecordedPenalty } from "./penalty-rules";
export { CATALOGUE, CATALOGUE_EDITION, getCatalogueTask, listVariants } from "./catalogue";
export { buildCustomTask, customTaskInputSchema, type CustomTaskInput } from "./custom";
export {
  parseTaskDefinition,
  taskDefinitionSchema,
  taskLetterSchema,
  type TaskDefinition,
  type TaskLetter,
  type WindowTask,
  type PokerTask,
  type AllUpTask,
} from "./definition";
export { TARGET_SHOWN_WITHIN_MS } from "./poker";
export { ALL_UP_ATTEMPTS } from "./definition";
export { maxResultTenths, sumCapTenths, isWindowBound } from "./limits";
export { flightsStartOnSignal } from "./launch-signal";
export { msToTenths, tenthsToSec, formatTenths, secondsText } from "./time";
export type { TimelineEvent } from "./timeline";
export type { ScoredFlight, FlightStatus, LaneScore } from "./score";
export type { FlightReason } from "./timing";
export type { LiveWarning, WarningCode } from "./warnings";
export {
  DEFAULT_RULE_SETTINGS,
  END_CALL_LABEL,
  HALVES_LABEL,
  ruleSettingsOf,
  ruleSettingsSchema,
  withRuleSettings,
  type RuleSettings,
} from "./rule-settings";
