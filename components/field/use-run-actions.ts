"use client";

import { useCallback } from "react";
import type { EventBody, RunEvent, Stamp } from "@/lib/events/schema";
import { flightTimeCorrection, launchTimeCorrection } from "@/lib/field/flight-fix";
import { stampForMoment } from "@/lib/field/input-time";
import { tapKindFor, undoTargetFor } from "@/lib/field/lane-tap";
import type { TimeSource } from "@/lib/field/time-source";
import { getPageId } from "@/lib/offline/device";
import { placedTimeline, type PhoneView } from "@/lib/offline/run-result";
import type { TaskDefinition } from "@/lib/tasks";
import { applyUndoAndCorrections } from "@/lib/tasks/timeline";
import type { BodyFor } from "./use-recorder";
import type { InvalidReason } from "@/lib/events/schema";
import type { PenaltyInput } from "./ruling-form";

type Deps = {
  task: TaskDefinition;
  laneCount: number;
  view: PhoneView;
  clocks: TimeSource;
  record: (stamp: Stamp, bodyFor: BodyFor) => Promise<RunEvent | null>;
  stampInput: (eventTimeStamp: number) => Stamp;
};

/** The live screen's actions; each records one event through the recorder's queue. */
export function useRunActions({ task, laneCount, view, clocks, record, stampInput }: Deps) {
  const { estimate } = view;
  // Every decision reads the stored events on the run's one timeline (lib/results/place.ts).
  const timeline = useCallback((evs: readonly RunEvent[]) => placedTimeline(evs, view), [view]);
  const now = () => stampInput(clocks.monoNow());
  const ok = (p: Promise<RunEvent | null>) => p.then((e) => e !== null);
  const fixed = (body: EventBody, stamp = now()) => ok(record(stamp, () => body));
  const hasStart = (evs: readonly RunEvent[]) => applyUndoAndCorrections(timeline(evs)).some((e) => e.body.kind === "window-start");
  // Task C gives one signal per attempt; every other task has one working-time start.
  const startBody = (evs: readonly RunEvent[]): EventBody | null => (task.kind === "all-up" || !hasStart(evs) ? { kind: "window-start" } : null);

  return {
    /** Launch or landing, decided when every earlier tap is stored (a cheap check: the live state is computed after the write). */
    tap: (lane: number, timeStamp: number) => record(stampInput(timeStamp), (evs) => ({ kind: tapKindFor(timeline(evs), lane, laneCount), lane })),
    start: (timeStamp: number) => record(stampInput(timeStamp), startBody),
    /** The countdown reached zero: the working time starts at the planned moment. */
    startAt: (wallMs: number) => record(stampForMoment(wallMs, clocks, getPageId(), estimate), (evs) => (hasStart(evs) ? null : { kind: "window-start" })),
    undo: (lane: number) =>
      ok(
        record(now(), (evs) => {
          const target = undoTargetFor(timeline(evs), lane);
          return target ? { kind: "void", targetId: target.id } : null;
        }),
      ),
    setTime: (lane: number, flightIndex: number, tenths: number) =>
      ok(record(now(), (evs) => flightTimeCorrection(timeline(evs), evs, lane, flightIndex, laneCount, tenths))),
    /** Moves a flight's launch to `tenths` of working time; resolves to why not, or null when stored. */
    setLaunch: async (lane: number, flightIndex: number, tenths: number): Promise<string | null> => {
      let refused: string | null = null;
      const stored = await ok(
        record(now(), (evs) => {
          const fix = launchTimeCorrection(timeline(evs), evs, lane, flightIndex, laneCount, tenths);
          if ("error" in fix) refused = fix.error;
          return "body" in fix ? fix.body : null;
        }),
      );
      return stored ? null : (refused ?? "The correction was not stored.");
    },
    /** Marks the flight launched by event `flightId` invalid: keyed by its launch, so an undo elsewhere cannot move it. */
    invalid: (lane: number, flightId: string, reason: InvalidReason) => fixed({ kind: "invalid", lane, flightId, reason }),
    penalty: (lane: number, p: PenaltyInput) => fixed({ kind: "penalty", lane, ...p }),
    /** "Not signed", "signed" (pilot and timekeeper, at a contest) or a re-flight grant on a lane. */
    ruling: (body: Extract<EventBody, { kind: "unsigned" | "signed" | "reflight" }>) => fixed(body),
    target: (lane: number, targetSec: number, timeStamp: number) => fixed({ kind: "target", lane, targetSec }, stampInput(timeStamp)),
    endCall: (lane: number, timeStamp: number) => fixed({ kind: "end-call", lane }, stampInput(timeStamp)),
    close: () => fixed({ kind: "run-end" }),
    /** The lane flies this model from now on (picked before the window, or a swap during it). */
    model: (lane: number, modelId: string) => fixed({ kind: "model", lane, modelId }),
  };
}
