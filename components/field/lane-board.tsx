"use client";

import { formatRunning, secondsText } from "@/lib/field/display";
import type { LaneLive } from "@/lib/tasks";
import { TapControl } from "./tap-control";

export type BoardLane = { lane: LaneLive; label: string; pilotName: string; showControl: boolean };

type Props = { lanes: readonly BoardLane[]; onTap: (lane: number, timeStamp: number) => void };

/**
 * Two to four lanes side by side, two to a row: each pilot's name, flight clock, result and the
 * launch/landed control, so every control is within reach without scrolling on a 360×640 phone.
 * Each lane's figures, strip, tools and flights follow below in its own panel.
 */
export function LaneBoard({ lanes, onTap }: Props) {
  return (
    <div className="grid grid-cols-2 gap-2" data-testid="lane-board">
      {lanes.map(({ lane, label, pilotName, showControl }) => {
        const inAir = lane.currentFlightMs !== null;
        return (
          <div key={lane.lane} className="min-w-0 space-y-1 rounded-xl border-2 border-line p-1.5">
            <p className="flex items-baseline justify-between gap-1 text-sm">
              <span className="truncate font-bold">
                <span className="figures">{lane.lane + 1}</span> {pilotName}
              </span>
              <span className="figures font-bold">
                <span className="sr-only">result </span>
                {secondsText(lane.resultTenths)}
              </span>
            </p>
            <p className="figures text-center text-2xl font-extrabold leading-none" data-testid={`board-clock-${lane.lane}`}>
              {inAir ? formatRunning(lane.currentFlightMs ?? 0) : "—"}
            </p>
            {showControl ? (
              <TapControl action={inAir ? "Landed" : "Launch"} laneLabel={label} inAir={inAir} size="board" onTap={(t) => onTap(lane.lane, t)} />
            ) : (
              <p className="py-2 text-center text-sm text-muted">Working time over</p>
            )}
          </div>
        );
      })}
    </div>
  );
}
