import { v7 as uuidv7 } from "uuid";
import { deriveAndStoreRuns } from "@/db/queries/runs";
import { events, fieldSessions, laneConsents, runLanes, runs } from "@/db/schema";
import type { TaskDefinition } from "@/lib/tasks";
import { db } from "./db";

/** A custom task: the three best flights count, each capped at 60 s, in 5 minutes (max 180.0 s). */
export const BEST_THREE: TaskDefinition = {
  edition: "custom", letter: null, name: "Best three of a minute", kind: "window", workingTimeSec: 300, landingWindowSec: 30,
  launchLimit: null, counting: { rule: "best", n: 3 }, capSec: 60, ladder: null, sumCap: false,
};

/** A custom ladder: 30 s then 60 s, in order (max 90.0 s); each flight has a target. */
export const LADDER: TaskDefinition = {
  edition: "custom", letter: null, name: "Half and one", kind: "window", workingTimeSec: 300, landingWindowSec: 30,
  launchLimit: 2, counting: { rule: "all" }, capSec: null, ladder: { order: "in-order", targetsSec: [30, 60] }, sumCap: false,
};

/** Flights as [launch, landing] in seconds after the window's start. */
type Flights = [number, number][];

/**
 * Stores a run of `pilot`'s flights as a phone would have recorded it (window start, launches
 * and landings, run end) and derives its result as a push does (deriveAndStoreRuns → lib/results).
 * `signals` (seconds after the first): the start signals of a task C run, one per attempt (default: one at 0).
 * `recordedBy` another account: the lane waits for the pilot's decision (`consent` sets one).
 */
export async function seasonRun(input: {
  pilotId: string; at: string; flights: Flights; task?: TaskDefinition; signals?: number[]; field?: string; recordedBy?: string; consent?: "accepted" | "hidden";
}): Promise<string> {
  const task = input.task ?? BEST_THREE;
  const recorder = input.recordedBy ?? input.pilotId;
  const startMs = Date.parse(input.at);
  const sessionId = uuidv7();
  const runId = uuidv7();
  await db.insert(fieldSessions).values({ id: sessionId, ownerId: recorder, fieldName: input.field ?? "Season Meadow", startedAt: new Date(startMs) });
  await db.insert(runs).values({ id: runId, sessionId, createdBy: recorder, task, taskCode: task.letter ?? "custom", edition: task.edition, createdAt: new Date(startMs) });
  await db.insert(runLanes).values({ runId, lane: 0, pilotUserId: input.pilotId, pilotName: "Season pilot" });
  const taps: [number, object][] = (input.signals ?? [0]).map((s) => [s * 1000, { kind: "window-start" }]);
  for (const [launch, land] of input.flights) taps.push([launch * 1000, { kind: "launch", lane: 0 }], [land * 1000, { kind: "landing", lane: 0 }]);
  taps.push([(task.kind === "all-up" ? Math.max(600, ...(input.signals ?? [0]).map((s) => s + 240)) : task.workingTimeSec + 40) * 1000, { kind: "run-end" }]);
  taps.sort((a, b) => a[0] - b[0]); // in time order, as a phone records them (stable: equal times keep their order)
  const deviceId = `season-${uuidv7()}`;
  await db.insert(events).values(taps.map(([offsetMs, body], i) => ({
    id: uuidv7(), runId, deviceId, seq: i + 1, recordedBy: recorder, kind: (body as { kind: string }).kind, body,
    wallMs: startMs + offsetMs, monoMs: 1000 + offsetMs, pageId: `season-${runId}`, correctedMs: startMs + offsetMs, uncertaintyMs: 10,
  })));
  if (input.consent) await db.insert(laneConsents).values({ runId, lane: 0, pilotUserId: input.pilotId, status: input.consent });
  await db.transaction((tx) => deriveAndStoreRuns(tx, [runId]));
  return runId;
}
