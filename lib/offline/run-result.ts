import type { ClockEstimate } from "@/lib/clock";
import type { RunEvent, Stamp } from "@/lib/events/schema";
import { placeEvents, placeStamp, runResult, type Estimates, type RecordedEvent, type RunResult } from "@/lib/results";
import { foldRun, type FoldedRun, type TaskDefinition, type TimelineEvent } from "@/lib/tasks";
import type { MetaValues, StoredRun, WindowcallDb } from "./db";

/** What this phone knows about itself when it scores a run: its id, its user, its clock estimate. */
export type PhoneView = { deviceId: string | null; me: string | null; estimate: ClockEstimate | null };

/** The phone's view, its three meta values in one read (one transaction, not one each: live queries re-read it on every write). */
export async function readPhoneView(db: WindowcallDb): Promise<PhoneView> {
  const [deviceId, profile, estimate] = await db.meta.bulkGet(["deviceId", "profile", "clockEstimate"]);
  return {
    deviceId: (deviceId?.value as MetaValues["deviceId"] | undefined) ?? null,
    me: (profile?.value as MetaValues["profile"] | undefined)?.id ?? null,
    estimate: (estimate?.value as MetaValues["clockEstimate"] | undefined) ?? null,
  };
}

/** The run's events as the one result function reads them (an unsynced own event has no recordedBy yet). */
export function recordedEvents(events: readonly RunEvent[], view: PhoneView): RecordedEvent[] {
  // Pulled events always name their recorder; one without was written on this phone, by its account.
  return events.map((e) => ({ ...e, recordedBy: e.recordedBy ?? view.me ?? "" }));
}

/** This phone's clock estimate, as the estimates of its own device. */
export function phoneEstimates(view: PhoneView): Estimates {
  return new Map(view.deviceId && view.estimate ? [[view.deviceId, [view.estimate]]] : []);
}

export type PhoneResult = RunResult & { folded: FoldedRun };

/**
 * A stored run scored on this phone by the one result function (lib/results runResult), the
 * same path the server takes: the field screen, the field's list, the logbook and the run page
 * all read this. `folded` is the task engine's fold of the events that count, for the strip,
 * the flight table and the breakdown.
 */
export function phoneResult(run: Pick<StoredRun, "lanes" | "recordedBy">, task: TaskDefinition, events: readonly RunEvent[], view: PhoneView): PhoneResult {
  const result = phoneRunResult(run, task, events, view);
  return { ...result, folded: foldRun(task, result.timeline, { laneCount: run.lanes.length }) };
}

/** phoneResult without the task engine's fold: for a screen that shows only the lanes' results. */
export function phoneRunResult(run: Pick<StoredRun, "lanes" | "recordedBy">, task: TaskDefinition, events: readonly RunEvent[], view: PhoneView): RunResult {
  return runResult({
    task,
    createdBy: run.recordedBy?.id ?? view.me ?? "",
    lanes: run.lanes.map((l) => ({ lane: l.lane, pilotUserId: l.pilotUserId ?? null })),
    officials: new Set(),
    events: recordedEvents(events, view),
    estimatesByDevice: phoneEstimates(view),
  });
}

/** Every event of the run placed on the run's timeline (no record chosen): for deciding what a tap records. */
export function placedTimeline(events: readonly RunEvent[], view: PhoneView): TimelineEvent[] {
  return placeEvents(recordedEvents(events, view), phoneEstimates(view)).events.map((e) => ({ id: e.id, atMs: e.correctedMs, body: e.body }));
}

/** A moment on this phone (a tap's stamp, or "now") on the run's timeline. */
export function placeOnRun(events: readonly RunEvent[], view: PhoneView, stamp: Stamp): number {
  return placeStamp(recordedEvents(events, view), phoneEstimates(view), view.deviceId ?? "", stamp);
}
