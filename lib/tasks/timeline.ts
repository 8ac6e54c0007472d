import type { EventBody } from "@/lib/events/schema";

/**
 * The engine's input: a run's events already placed on one clock by the sync layer
 * (lib/clock maps device stamps to it; for a single device, atMs = stamp.wallMs).
 */
export type TimelineEvent = { id: string; atMs: number; body: EventBody };

/** The effective events after undo (`void`) and `correct` have been applied, in time order. */
export type EffectiveEvent = TimelineEvent & { order: number };

// At equal times a landing closes the open flight before the next launch opens one, and a
// target or end-of-working-time call precedes the launch it is meant for.
const TIE_RANK: Record<EventBody["kind"], number> = {
  "window-start": 0,
  landing: 1,
  target: 2,
  "end-call": 3,
  launch: 4,
  invalid: 5,
  penalty: 5,
  unsigned: 5,
  signed: 7, // signed after the round: nothing after it at the same instant changes
  reflight: 5,
  model: 3, // a model picked at the instant of a launch flies that launch
  correct: 6,
  void: 6,
  "run-end": 7,
};

/**
 * Applies `void` and `correct` and sorts the rest by time.
 *
 * - An event is void when a void event that is not itself void names it, so voiding a void
 *   restores its target (undo of an undo).
 * - Several corrections of one event: the latest recorded (by atMs, then id) wins; the
 *   corrected time is `body.wallMs`, taken as the event's new atMs.
 * - `void`/`correct` events themselves are not returned.
 */
export function applyUndoAndCorrections(events: readonly TimelineEvent[]): EffectiveEvent[] {
  const byId = new Map<string, TimelineEvent>();
  const voidsOf = new Map<string, TimelineEvent[]>();
  for (const e of events) {
    byId.set(e.id, e);
    if (e.body.kind === "void") {
      const list = voidsOf.get(e.body.targetId);
      if (list) list.push(e);
      else voidsOf.set(e.body.targetId, [e]);
    }
  }
  const memo = new Map<string, boolean>();
  const isVoid = (id: string, depth: number): boolean => {
    const known = memo.get(id);
    if (known !== undefined) return known;
    // Chains are short in practice; the depth bound only guards against malformed cycles.
    const result = depth < 64 && (voidsOf.get(id) ?? []).some((v) => !isVoid(v.id, depth + 1));
    memo.set(id, result);
    return result;
  };

  const corrected = new Map<string, TimelineEvent>();
  for (const e of events) {
    if (e.body.kind !== "correct" || voidsOf.size > 0 && isVoid(e.id, 0)) continue;
    const prev = corrected.get(e.body.targetId);
    if (!prev || prev.atMs < e.atMs || (prev.atMs === e.atMs && prev.id < e.id)) corrected.set(e.body.targetId, e);
  }

  const out: EffectiveEvent[] = [];
  for (let i = 0; i < events.length; i++) {
    const e = events[i]!;
    if (e.body.kind === "void" || e.body.kind === "correct") continue;
    if (voidsOf.size > 0 && isVoid(e.id, 0)) continue;
    const fix = corrected.get(e.id);
    const atMs = fix && fix.body.kind === "correct" && isTimed(e.body) ? fix.body.wallMs : e.atMs;
    out.push({ id: e.id, atMs, body: e.body, order: i });
  }
  out.sort((a, b) => a.atMs - b.atMs || TIE_RANK[a.body.kind] - TIE_RANK[b.body.kind] || a.order - b.order);
  return out;
}

function isTimed(body: EventBody): boolean {
  return body.kind === "window-start" || body.kind === "launch" || body.kind === "landing";
}
