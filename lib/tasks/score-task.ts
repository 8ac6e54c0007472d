import type { TaskLetter, TaskDefinition } from "./definition";
import { ALL_UP_ATTEMPTS, parseTaskDefinition, taskLetterSchema } from "./definition";
import { findCatalogueTask } from "./catalogue";
import { foldRun } from "./fold";
import { maxResultTenths } from "./limits";
import type { FlightStatus } from "./score";
import type { FlightReason } from "./timing";
import type { TimelineEvent } from "./timeline";
import { tenthsToSec } from "./time";

/** One flight for scoreTask, in ms from the start of working time (task C: from its attempt's signal). */
export type FlightInput = {
  launchMs: number;
  /** null when the model never landed (it scores zero). */
  landMs: number | null;
  /** Task E: the target announced for this flight (ignored while an earlier one is unreached). */
  targetSec?: number;
  /** Task E: "end of working time" called before this flight. */
  endCall?: boolean;
};

export type ScoreTaskInput = {
  task: TaskLetter | TaskDefinition;
  /** Picks a variant: 420 / 600 / 900 (default: the 10-minute one; 900 for M). Task C: ignored, see `attempts`. */
  workingTimeSec?: number;
  /** Task C: number of attempts (3–5, F3K.11.3); default: one per flight given, at least 3. */
  attempts?: number;
  flights: readonly FlightInput[];
};

export type ScoreTaskResult = {
  /** The task result in seconds: tenths / 10, e.g. 569 or 142.5. */
  seconds: number;
  tenths: number;
  maxSeconds: number;
  /** True when the F3K.7 sum cap cut the total. */
  sumCapApplied: boolean;
  flights: { countedTenths: number; status: FlightStatus; reason: FlightReason | null }[];
};

// Task C attempts are laid out this far apart on the synthetic timeline (far beyond 3:33).
const ATTEMPT_SPACING_MS = 10_000_000;
const ZERO_ID = "00000000-0000-7000-8000-";

/**
 * Scores a list of flights for a catalogue task (or any definition) through the same event
 * fold the field timer uses: the flights become launch/landing (and target) events on one
 * timeline, so this is exactly the score a timed run with those taps gets.
 */
export function scoreTask(input: ScoreTaskInput): ScoreTaskResult {
  const def = resolveDefinition(input);
  const events: TimelineEvent[] = [];
  let n = 0;
  const add = (atMs: number, body: TimelineEvent["body"]) =>
    events.push({ id: ZERO_ID + String(n++).padStart(12, "0"), atMs, body });

  if (def.kind === "all-up") {
    for (let k = 0; k < def.attempts; k++) add(k * ATTEMPT_SPACING_MS, { kind: "window-start" });
  } else add(0, { kind: "window-start" });

  input.flights.forEach((f, i) => {
    const base = def.kind === "all-up" ? i * ATTEMPT_SPACING_MS : 0;
    if (f.endCall) add(base + f.launchMs, { kind: "end-call", lane: 0 });
    if (f.targetSec !== undefined) add(base + f.launchMs, { kind: "target", lane: 0, targetSec: f.targetSec });
    add(base + f.launchMs, { kind: "launch", lane: 0 });
    if (f.landMs !== null) add(base + f.landMs, { kind: "landing", lane: 0 });
  });

  const lane = foldRun(def, events, { laneCount: 1 }).lanes[0]!;
  return {
    seconds: tenthsToSec(lane.resultTenths),
    tenths: lane.resultTenths,
    maxSeconds: tenthsToSec(maxResultTenths(def)),
    sumCapApplied: lane.resultTenths < lane.rawTenths,
    flights: lane.flights.map((f) => ({ countedTenths: f.creditedTenths, status: f.status, reason: f.reason })),
  };
}

/** The definition to score; throws a ZodError for one the rules do not allow (task C: 3–5 attempts). */
function resolveDefinition(input: ScoreTaskInput): TaskDefinition {
  if (typeof input.task !== "string") return parseTaskDefinition(input.task);
  const letter = taskLetterSchema.parse(input.task);
  if (letter === "C") {
    const base = findCatalogueTask("C");
    const attempts = input.attempts ?? Math.max(ALL_UP_ATTEMPTS.min, input.flights.length);
    return parseTaskDefinition({ ...base, attempts });
  }
  return findCatalogueTask(letter, input.workingTimeSec);
}
