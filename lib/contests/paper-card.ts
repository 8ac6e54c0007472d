import { scoreTask, type ScoreTaskResult, type TaskDefinition } from "@/lib/tasks";

/** The most flights one paper card row takes (a card has room for a task's flights and a few refused ones). */
export const PAPER_MAX_FLIGHTS = 20;
/** The longest flight time a paper card takes, in tenths of a second (one hour). */
export const PAPER_MAX_FLIGHT_TENTHS = 36_000;

/** Whether a round's task can be entered from paper cards: task E needs each flight's announced target, which the card does not carry yet. */
export function paperCardProblem(task: TaskDefinition): string | null {
  return task.kind === "poker" ? "Paper cards for task E (targets announced per flight) are not supported yet: time this round on the phones." : null;
}

/**
 * A paper card's flight times (tenths of a second, in flown order) scored by the task engine
 * (scoreTask, the same fold the field timer uses). The card gives durations, not clock times,
 * so the flights are laid out one after another from the start of working time with no gap
 * between a landing and the next launch: the most a pilot could have flown; working time and
 * the landing window still cut what does not fit. Task C: each flight is its own attempt.
 */
export function paperCardResult(task: TaskDefinition, flightsTenths: readonly number[]): ScoreTaskResult {
  let at = 0;
  const flights = flightsTenths.map((tenths) => {
    const ms = Math.max(0, Math.trunc(tenths)) * 100;
    if (task.kind === "all-up") return { launchMs: 0, landMs: ms };
    const flight = { launchMs: at, landMs: at + ms };
    at += ms;
    return flight;
  });
  return scoreTask({ task, flights });
}

/**
 * Reads a flight time as typed on a paper card: seconds ("83.4", "83,4") or minutes and seconds
 * ("1:23.4"), to 0.1 s, truncated (never rounded up, F3K.7). Null when it is not a time.
 */
export function parseFlightTime(text: string): number | null {
  const t = text.trim().replace(",", ".");
  const m = /^(?:(\d{1,2}):)?(\d{1,4})(?:\.(\d+))?$/.exec(t);
  if (!m) return null;
  const minutes = m[1] === undefined ? 0 : Number(m[1]);
  const seconds = Number(m[2]);
  if (m[1] !== undefined && seconds >= 60) return null;
  const tenths = (minutes * 60 + seconds) * 10 + Number((m[3] ?? "0")[0]);
  return tenths <= PAPER_MAX_FLIGHT_TENTHS ? tenths : null;
}

/** Reads the typed times: the flights in tenths, or the first word that is not a time. */
export function readTimes(text: string): { flights: number[]; bad: string | null } {
  const words = text.split(/[\s;]+/).filter(Boolean);
  const flights: number[] = [];
  for (const w of words) {
    const t = parseFlightTime(w);
    if (t === null) return { flights, bad: w };
    flights.push(t);
  }
  return { flights, bad: null };
}
