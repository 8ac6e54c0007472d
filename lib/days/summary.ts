// The lines of a field day's summary e-mail, from the Day board's aggregates (the same numbers the
// board shows). Pure: the caller passes names and how to print a time of day.
import type { DayBoard, DayBoardView } from "./board";
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

/** The summary lines of a board as the server built it, times on the club's clock (its names: `people`). */
export function boardSummaryLines(board: DayBoardView): string[] {
  const timeOfDay = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", timeZone: board.timeZone });
  return daySummaryLines(board, (id) => board.people[id] ?? "a member", (ms) => timeOfDay.format(ms), board.timeZone);
}

/**
 * The first line of an updated summary: which lane an officer decided after the close, whose record
 * counts now and the lane's result on the board before and after. `recorder` null: no record is chosen
 * by hand any more (the decision became a note), so the conflict rules' pick counts again.
 */
export function decisionChangeLine(input: {
  pilot: string; taskCode: string; /** The window's start on the club's clock, with the zone's name. */ startText: string; recorder: string | null; beforeTenths: number | null; afterTenths: number | null;
}): string {
  const result = (t: number | null) => (t === null ? "no result" : seconds(t));
  const counts = input.recorder === null ? "the record the rules pick counts again" : `the record of ${input.recorder}'s phone counts now`;
  return `${input.pilot}'s window at ${input.startText} (${taskName(input.taskCode)}): ${counts}, ${result(input.afterTenths)} (was ${result(input.beforeTenths)}).`;
}

const WEEKDAYS = ["Sun", "Mon", "Tue", "Wed", "Thu", "Fri", "Sat"];
const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** "2026-07-04" as "Sat 4 Jul 2026" (the same whatever the server's locale data). */
export function dayLabel(day: string): string {
  const d = new Date(`${day}T12:00:00Z`);
  return `${WEEKDAYS[d.getUTCDay()]} ${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}`;
}
