import type { RunEvent } from "@/lib/events/schema";
import { secondsText } from "@/lib/field/display";
import type { RunLane } from "@/lib/events/entities";
import { liveState, type TaskDefinition, type TimelineEvent } from "@/lib/tasks";

/**
 * What a screen reader hears after a write is stored: "Launch, lane 1", "Landed 59.8 s",
 * "Working time started"… The lane is named only when there are several.
 */
export function describeWrite(event: RunEvent, task: TaskDefinition, timeline: readonly TimelineEvent[], nowMs: number, lanes: readonly RunLane[]): string | null {
  const b = event.body;
  const laneSuffix = (lane: number) => (lanes.length > 1 ? `, lane ${lane + 1} (${lanes.find((l) => l.lane === lane)?.pilotName ?? ""})` : "");
  switch (b.kind) {
    case "window-start":
      return "Working time started";
    case "launch":
      return `Launch${laneSuffix(b.lane)}`;
    case "landing": {
      const lane = liveState(task, timeline, nowMs, { laneCount: lanes.length }).lanes[b.lane];
      const flight = lane ? [...lane.flights].reverse().find((f) => f.landMs !== null) : undefined;
      const time = flight && flight.landMs !== null && flight.airTenths !== null ? ` ${secondsText(flight.airTenths)} s` : "";
      return `Landed${time}${laneSuffix(b.lane)}`;
    }
    case "target":
      return `Target ${b.targetSec} s called${laneSuffix(b.lane)}`;
    case "end-call":
      return `End of working time called${laneSuffix(b.lane)}`;
    case "void":
      return "Undone";
    case "correct":
      return "Time corrected";
    case "invalid": {
      const flight = liveState(task, timeline, nowMs, { laneCount: lanes.length }).lanes[b.lane]?.flights.find((f) => f.launchId === b.flightId);
      return `${flight ? `Flight ${flight.index + 1}` : "Flight"} marked invalid${laneSuffix(b.lane)}`;
    }
    case "penalty":
      return `Penalty ${b.points} points${laneSuffix(b.lane)}`;
    case "unsigned":
      return `Result not signed${laneSuffix(b.lane)}`;
    case "signed":
      return `Result signed${laneSuffix(b.lane)}`;
    case "reflight":
      return `Re-flight granted${laneSuffix(b.lane)}`;
    case "run-end":
      return "Window closed";
    case "model":
      return `Model changed${laneSuffix(b.lane)}`;
  }
}
