import type { TaskDefinition } from "./definition";
import type { Outlook } from "./best-possible";
import type { LaneScore } from "./score";

/**
 * The target to fly next and the targets still open, for target tasks.
 * - In-order ladders (K, M): the step of the flight in the air, else of the next launch.
 * - Any-order ladders (H): targets whose matched flight fell short; "next" suggests the
 *   longest of them that still fits in the working time left (else the longest).
 * - Poker (E): the announced target still unreached (null: a target must be called).
 */
export function nextTargets(def: TaskDefinition, lane: LaneScore, outlook: Outlook): { next: number | null; remaining: number[] } {
  if (def.kind === "poker") {
    const pending = lane.poker?.pendingTargetSec ?? null;
    const openTarget = lane.flights.find((f) => f.open && f.excludedReason === null)?.targetSec ?? null;
    return { next: pending ?? openTarget, remaining: pending === null ? [] : [pending] };
  }
  if (def.kind !== "window" || !def.ladder) return { next: null, remaining: [] };
  const targets = def.ladder.targetsSec;
  const eligible = lane.flights.filter((f) => f.excludedReason === null);
  if (def.ladder.order === "in-order") {
    if (def.counting.rule !== "all") return { next: null, remaining: [...targets] };
    const open = eligible.findIndex((f) => f.open);
    const position = open >= 0 ? open : eligible.length;
    const remaining = targets.slice(position);
    return { next: remaining[0] ?? null, remaining };
  }
  const remaining = [...targets];
  for (const f of eligible) {
    if (f.open || !f.counted || f.slotCapTenths === null || f.creditedTenths < f.slotCapTenths) continue;
    const at = remaining.indexOf(f.slotCapTenths / 10);
    if (at >= 0) remaining.splice(at, 1);
  }
  remaining.sort((a, b) => b - a);
  const fits = remaining.find((t) => t * 10 <= outlook.timeLeftTenths);
  return { next: fits ?? remaining[0] ?? null, remaining };
}
