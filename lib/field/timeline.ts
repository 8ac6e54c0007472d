import { correctTime, SLEEP_TOLERANCE_MS } from "@/lib/clock";
import type { RunEvent } from "@/lib/events/schema";
import type { TimelineEvent } from "@/lib/tasks";

/** Where "now" is and which device and page lifetime this screen runs in. */
export type TimelineContext = {
  deviceId: string;
  pageId: string;
  wallNow: number;
  monoNow: number;
  /** This device's current offset estimate (server − device), or null if never measured. */
  thetaMs: number | null;
};

/**
 * Places a run's stored events on this device's wall clock (the live screen's timeline),
 * so the screen is a pure function of the events and "now" (SYNC.md §4):
 * - events of this page lifetime: anchored to now by the monotonic clock, so durations
 *   inside one page lifetime are exact and immune to wall-clock steps — unless wall and
 *   monotonic ages disagree by more than SLEEP_TOLERANCE_MS (the device slept);
 * - other events of this device: their stamped wall time (survives reloads and sleeps);
 * - other devices' events: their corrected (server) time moved onto this device's clock
 *   by this device's own offset.
 * A correction's new time is kept relative to the event it corrects, so it moves with it.
 */
export function buildTimeline(events: readonly RunEvent[], ctx: TimelineContext): TimelineEvent[] {
  const shift = new Map<string, number>(); // event id → atMs − stamp.wallMs
  for (const e of events) shift.set(e.id, placeEvent(e, ctx) - e.stamp.wallMs);
  return events.map((e) => {
    const atMs = e.stamp.wallMs + shift.get(e.id)!;
    if (e.body.kind !== "correct") return { id: e.id, atMs, body: e.body };
    const targetShift = shift.get(e.body.targetId) ?? shift.get(e.id)!;
    return { id: e.id, atMs, body: { ...e.body, wallMs: e.body.wallMs + targetShift } };
  });
}

/** The time of one event on this device's wall clock. */
export function placeEvent(e: RunEvent, ctx: TimelineContext): number {
  if (e.deviceId === ctx.deviceId) {
    if (e.stamp.pageId === ctx.pageId) {
      const monoAge = ctx.monoNow - e.stamp.monoMs;
      const wallAge = ctx.wallNow - e.stamp.wallMs;
      if (Math.abs(wallAge - monoAge) <= SLEEP_TOLERANCE_MS) return ctx.wallNow - monoAge;
    }
    return e.stamp.wallMs;
  }
  return correctTime(e.stamp).serverMs - (ctx.thetaMs ?? 0);
}
