import type { Stamp } from "@/lib/events/schema";
import type { ClockEstimate } from "@/lib/clock";
import type { TimeSource } from "./time-source";

/**
 * The longest believable delay between an input and its handler. An `event.timeStamp`
 * further back than this, or in the future, is not on this page's monotonic clock (some
 * older browsers stamped events in epoch ms; a faked clock in tests differs too).
 */
export const MAX_INPUT_LAG_MS = 5000;

/**
 * The monotonic time of record for an input: its own `event.timeStamp` (SYNC.md §2) when
 * that lies on the page's monotonic clock, else the handler's "now".
 */
export function inputMonoOf(eventTimeStamp: number, monoNow: number): { monoMs: number; fromInput: boolean } {
  const lag = monoNow - eventTimeStamp;
  if (Number.isFinite(eventTimeStamp) && lag >= 0 && lag <= MAX_INPUT_LAG_MS) return { monoMs: eventTimeStamp, fromInput: true };
  return { monoMs: monoNow, fromInput: false };
}

/**
 * Stamp for a scheduled moment rather than an input (the working time starting itself when
 * the preparation countdown ends): wall time of the plan, monotonic time derived from it
 * when the plan was made in this page lifetime, else the page's "now".
 */
export function stampForMoment(
  atWallMs: number,
  clocks: TimeSource,
  pageId: string,
  offset: ClockEstimate | null,
): Stamp {
  const mono = clocks.monoNow() - (clocks.wallNow() - atWallMs);
  return { wallMs: atWallMs, monoMs: Math.max(0, mono), pageId, offset };
}
