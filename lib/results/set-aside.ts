import type { PenaltyCause, RunEvent } from "@/lib/events/schema";

/** A phone's penalty an officer set aside (a `void` with `setAside`, db/queries/contest-phone-set-aside.ts). */
export type SetAsidePenalty = {
  /** The `penalty` event's id, and the set-aside event's. */
  penaltyId: string; id: string;
  lane: number; points: number; cause: PenaltyCause | null;
  /** The timekeeper's reason for the penalty. */
  penaltyReason: string;
  /** The officer's name as the event carries it (null for an event without it), and when (the server's clock). */
  by: string | null; atMs: number;
  /** Why the officer set it aside. */
  why: string;
};

/**
 * The phone penalties of a run an officer set aside, oldest decision first: each set-aside joined to the
 * penalty it names (one the phone does not hold is left out). The fold needs nothing of this — a set-aside
 * is an undo to runResult —; it is what the run page shows so the decision reads as the officer's, not a
 * phone's undo.
 */
export function setAsidePenalties(events: readonly Pick<RunEvent, "id" | "stamp" | "body">[]): SetAsidePenalty[] {
  const byId = new Map(events.map((e) => [e.id, e]));
  const out: SetAsidePenalty[] = [];
  for (const e of events) {
    if (e.body.kind !== "void" || !e.body.setAside) continue;
    const target = byId.get(e.body.targetId);
    if (!target || target.body.kind !== "penalty") continue;
    const p = target.body;
    out.push({
      penaltyId: target.id, id: e.id, lane: p.lane, points: p.points, cause: p.cause ?? null, penaltyReason: p.reason,
      by: e.body.setAside.by ?? null, atMs: e.stamp.wallMs, why: e.body.setAside.reason,
    });
  }
  return out.sort((a, b) => a.atMs - b.atMs);
}
