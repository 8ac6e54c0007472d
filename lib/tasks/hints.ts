import type { TaskDefinition } from "./definition";
import { foldAt } from "./fold";
import type { RunClock } from "./run-clock";
import type { TimelineEvent } from "./timeline";

/** What one more flight of `sec` seconds, launched now, would add to the lane's result (tenths). */
export type LengthHint = { sec: number; gainTenths: number };

const HINT_ID = "ffffffff-ffff-7fff-bfff-";

/**
 * Task H and other any-order ladders: for each target length that still fits in the working time
 * left, what a flight of that length launched now would add to the result ("fly 2:00 → +120.0"),
 * longest first, leaving out lengths that add nothing. Computed by the engine itself: the flight
 * is added to the lane's events and the run folded again, so the hint is what the result would do.
 * Empty while a model is in the air, before the start and after working time.
 */
export function lengthHints(
  def: TaskDefinition,
  events: readonly TimelineEvent[],
  clock: RunClock,
  nowMs: number,
  lane: number,
  laneCount: number,
  currentTenths: number,
): LengthHint[] {
  if (def.kind !== "window" || def.ladder?.order !== "any-order" || !clock.launchOpen || clock.phase !== "working") return [];
  const lengths = [...new Set(def.ladder.targetsSec)].sort((a, b) => b - a).filter((s) => s * 1000 <= clock.flyLeftMs);
  const out: LengthHint[] = [];
  for (const sec of lengths) {
    const extra: TimelineEvent[] = [
      { id: `${HINT_ID}000000000001`, atMs: nowMs, body: { kind: "launch", lane } },
      { id: `${HINT_ID}000000000002`, atMs: nowMs + sec * 1000, body: { kind: "landing", lane } },
    ];
    const after = foldAt(def, [...events, ...extra], null, laneCount).lanes[lane]?.resultTenths ?? 0;
    const gainTenths = after - currentTenths;
    if (gainTenths > 0) out.push({ sec, gainTenths });
  }
  return out;
}
