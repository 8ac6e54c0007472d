import type { DetectedLaunch } from "./detect";

/**
 * Matching the launches found in a log to the launch events of the run's lane, on the run's
 * corrected timeline (events as lib/results places them).
 *
 * The logger's clock and the phones' corrected clock may disagree by a constant. Every pairing
 * of a detected launch with an event proposes such an offset; the offset that pairs the most
 * launches within MATCH_WINDOW_MS wins (ties: the smaller offset). An offset beyond
 * UNCONFIRMED_MS counts only when at least two launches agree on it: one launch alone could
 * be paired with any event, and that would be a guess. Each event takes at most one launch (the
 * nearest); what is left is listed as unmatched, never attached to a flight.
 */
export const MATCH_WINDOW_MS = 2000;
export const UNCONFIRMED_MS = 30_000;
export const MAX_OFFSET_MS = 10 * 60_000;

export type LaunchEvent = { id: string; atMs: number };
export type MatchedLaunch = DetectedLaunch & {
  /** The launch on the run's timeline (log time + the common offset). */
  correctedMs: number;
  eventId: string | null;
  /** Log time − event time: how far the logger's clock is from the run's, for this launch. */
  gapMs: number | null;
};

export function matchLaunches(found: readonly DetectedLaunch[], events: readonly LaunchEvent[]): { offsetMs: number; launches: MatchedLaunch[] } {
  let best = { offsetMs: 0, count: 0 };
  for (const f of found) {
    for (const e of events) {
      const offsetMs = e.atMs - f.atMs;
      if (Math.abs(offsetMs) > MAX_OFFSET_MS) continue;
      const count = pair(found, events, offsetMs).filter((p) => p !== null).length;
      const confirmed = Math.abs(offsetMs) <= UNCONFIRMED_MS || count >= 2;
      if (confirmed && (count > best.count || (count === best.count && Math.abs(offsetMs) < Math.abs(best.offsetMs)))) best = { offsetMs, count };
    }
  }
  const pairs = pair(found, events, best.offsetMs);
  return {
    offsetMs: best.offsetMs,
    launches: found.map((f, i) => {
      const e = pairs[i] ?? null;
      return { ...f, correctedMs: f.atMs + best.offsetMs, eventId: e?.id ?? null, gapMs: e ? f.atMs - e.atMs : null };
    }),
  };
}

/** For each found launch, the event it pairs with at this offset (nearest first, each event once). */
function pair(found: readonly DetectedLaunch[], events: readonly LaunchEvent[], offsetMs: number): (LaunchEvent | null)[] {
  const candidates: { i: number; e: LaunchEvent; d: number }[] = [];
  found.forEach((f, i) => {
    for (const e of events) {
      const d = Math.abs(f.atMs + offsetMs - e.atMs);
      if (d <= MATCH_WINDOW_MS) candidates.push({ i, e, d });
    }
  });
  candidates.sort((a, b) => a.d - b.d);
  const out: (LaunchEvent | null)[] = found.map(() => null);
  const used = new Set<string>();
  for (const c of candidates) {
    if (out[c.i] || used.has(c.e.id)) continue;
    out[c.i] = c.e;
    used.add(c.e.id);
  }
  return out;
}
