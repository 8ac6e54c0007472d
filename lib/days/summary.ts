// The lines of a field day's summary e-mail, from the Day board's aggregates (the same numbers the
// board shows). Pure: the caller passes names and how to print a time of day.
import type { DayBoard } from "./board";
import { bestQuarter } from "./lift-timeline";

const seconds = (tenths: number) => `${(tenths / 10).toFixed(1)} s`;
const taskName = (code: string) => (code === "custom" ? "custom task" : `task ${code}`);

export function daySummaryLines(
  board: Pick<DayBoard, "runs" | "best" | "flightLeaders" | "turnaroundLeaders" | "lift">,
  nameOf: (id: string) => string,
  formatTime: (ms: number) => string,
  /** The club's time zone, named after the time (formatTime prints on its clock). */
  timeZone = "UTC",
): string[] {
  const pilots = new Set(board.runs.flatMap((r) => r.lanes.map((l) => l.pilotId)));
  if (board.runs.length === 0) return ["No runs were recorded at the day's fields."];
  const lines = [`${board.runs.length} ${board.runs.length === 1 ? "window" : "windows"} flown by ${pilots.size} ${pilots.size === 1 ? "pilot" : "pilots"}.`];
  for (const task of board.best) {
    const top = task.rows[0];
    if (top) lines.push(`Best in ${taskName(task.taskCode)}: ${nameOf(top.pilotId)}, ${seconds(top.resultTenths)}.`);
  }
  const longest = board.flightLeaders[0];
  if (longest) lines.push(`Longest flight: ${nameOf(longest.pilotId)}, ${seconds(longest.longestTenths)}.`);
  const quickest = board.turnaroundLeaders[0];
  if (quickest) lines.push(`Quickest turnaround (median): ${nameOf(quickest.pilotId)}, ${(quickest.medianGroundMs / 1000).toFixed(1)} s.`);
  const air = bestQuarter(board.lift);
  if (air) lines.push(`Best air: the quarter hour from ${formatTime(air.startMs)} (${timeZone}).`);
  return lines;
}

const WEEKDAYS = ["Sun", "Mon", "Tue", "Wed", "Thu", "Fri", "Sat"];
const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** "2026-07-04" as "Sat 4 Jul 2026" (the same whatever the server's locale data). */
export function dayLabel(day: string): string {
  const d = new Date(`${day}T12:00:00Z`);
  return `${WEEKDAYS[d.getUTCDay()]} ${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}`;
}
