"use client";

import type { ReactNode } from "react";
import { ClockNote, TimelineStrip } from "@/components/run";
import type { RunLane } from "@/lib/events/entities";
import type { LaneDerivation } from "@/lib/results";
import { TARGET_SHOWN_WITHIN_MS, type LaneLive, type LiveState, type TaskDefinition } from "@/lib/tasks";
import { FlightList } from "./flight-list";
import { LaneBoard, type BoardLane } from "./lane-board";
import { LanePanel } from "./lane-panel";
import { LaneTools } from "./lane-tools";
import { NextAttemptControl } from "./next-attempt";
import { TapControl } from "./tap-control";
import { TargetPicker } from "./target-picker";
import type { useRunActions } from "./use-run-actions";

type Props = {
  task: TaskDefinition;
  live: LiveState;
  lanes: readonly RunLane[];
  actions: ReturnType<typeof useRunActions>;
  /** The lane's model choice (the hangar), for lanes the signed-in pilot flies. */
  modelPicker?: (lane: RunLane, label: string) => ReactNode;
  /** The run's result per lane (lib/results): its clock flags are shown on the lane while it is flown. */
  derivations?: readonly LaneDerivation[];
};

/**
 * Every lane of the window (one pilot each, up to four) and the closing control. With several
 * lanes, their controls sit together on the board at the top (within reach without scrolling),
 * and each lane's panel below holds the rest.
 */
export function LaneArea({ task, live, lanes, actions, modelPicker, derivations }: Props) {
  const solo = lanes.length === 1;
  const over = live.phase === "ended";
  const anyInAir = live.lanes.some((l) => l.currentFlightMs !== null);
  const board: BoardLane[] = solo
    ? []
    : lanes.flatMap((l) => {
        const lane = live.lanes[l.lane];
        return lane ? [{ lane, label: `Lane ${l.lane + 1} · ${l.pilotName}`, pilotName: l.pilotName, showControl: !over || lane.currentFlightMs !== null }] : [];
      });
  return (
    <div className="space-y-5">
      {solo ? null : <LaneBoard lanes={board} onTap={(lane, t) => void actions.tap(lane, t)} />}
      {lanes.map((l) => {
        const lane = live.lanes[l.lane];
        if (!lane) return null;
        const label = solo ? l.pilotName : `Lane ${l.lane + 1} · ${l.pilotName}`;
        const inAir = lane.currentFlightMs !== null;
        const showControl = !over || inAir;
        const list = (
          <FlightList
            flights={lane.flights}
            laneLabel={label}
            onSetTime={(i, t) => actions.setTime(l.lane, i, t)}
            onSetLaunch={(i, t) => actions.setLaunch(l.lane, i, t)}
            onInvalid={(i, r) => actions.invalid(l.lane, i, r)}
          />
        );
        const tools = (
          <LaneTools
            laneLabel={label}
            canUndo={lane.flights.length > 0}
            undoWhat={null}
            onUndo={() => void actions.undo(l.lane)}
            flights={lane.flights}
            onPenalty={(p) => actions.penalty(l.lane, p)}
            onUnsigned={() => actions.ruling({ kind: "unsigned", lane: l.lane })}
            onReflight={(cause, placement) => actions.ruling({ kind: "reflight", lane: l.lane, cause, placement })}
          />
        );
        return (
          <LanePanel
            key={l.lane}
            lane={lane}
            label={label}
            solo={solo}
            elapsedMs={live.elapsedMs}
            strip={<TimelineStrip definition={task} flights={lane.flights} nowMs={live.elapsedMs} label={label} />}
            picker={needsTarget(task, lane, live) ? (
              <TargetPicker
                laneLabel={label}
                secondsLeft={live.workingTimeLeftMs === null ? null : Math.floor(live.workingTimeLeftMs / 1000)}
                allowEndCall={task.kind === "poker" && task.endCall !== "not-allowed"}
                onTarget={(s, t) => void actions.target(l.lane, s, t)}
                onEndCall={(t) => void actions.endCall(l.lane, t)}
              />
            ) : null}
            note={<ClockNote derivation={derivations?.find((d) => d.lane === l.lane)} />}
            control={solo && showControl ? <TapControl action={inAir ? "Landed" : "Launch"} laneLabel={label} inAir={inAir} size={solo ? "solo" : "lane"} onTap={(t) => void actions.tap(l.lane, t)} /> : null}
            tools={<>{modelPicker?.(l, label)}{tools}</>}
            list={solo ? list : <details><summary className="min-h-12 cursor-pointer py-3 font-bold">Flights and fixes</summary>{list}</details>}
          />
        );
      })}
      {over && !anyInAir && live.attempt && live.attempt.index + 1 < live.attempt.of ? (
        <NextAttemptControl attempt={live.attempt.index + 2} of={live.attempt.of} onSignal={(t) => void actions.start(t)} />
      ) : null}
      {live.phase === "ended" || (live.phase === "landing-window" && !anyInAir) ? (
        <button type="button" onClick={() => void actions.close()} className="min-h-touch w-full rounded-2xl bg-accent text-2xl font-extrabold text-accent-ink">
          Close the window and see the result
        </button>
      ) : (
        <details className="rounded-xl border-2 border-line p-3">
          <summary className="min-h-12 cursor-pointer py-3 font-bold">End this window early</summary>
          <button type="button" onClick={() => void actions.close()} className="min-h-touch w-full rounded-xl border-2 border-danger font-bold text-danger">
            Close the window now
          </button>
        </details>
      )}
    </div>
  );
}

/** Task E: the picker shows while no target is pending and target places are left. */
function needsTarget(task: TaskDefinition, lane: LaneLive, live: LiveState): boolean {
  if (task.kind !== "poker" || live.phase !== "working" || lane.nextTargetSec !== null) return false;
  // Announced before the launch, or shown right after release; later the engine refuses it (F3K.11.5).
  if (lane.currentFlightMs !== null && lane.currentFlightMs > TARGET_SHOWN_WITHIN_MS) return false;
  const reached = lane.flights.filter((f) => (f.status === "counted" || f.status === "capped") && f.creditedTenths > 0).length;
  return reached < task.maxTargets;
}
