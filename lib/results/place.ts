import { correctTime, SLEEP_TOLERANCE_MS, type ClockEstimate } from "@/lib/clock";
import type { EventBody, Stamp } from "@/lib/events/schema";

/** An event as any device or the server holds it: who recorded it, its raw stamp, its body. */
export type RecordedEvent = { id: string; deviceId: string; seq?: number; recordedBy: string; stamp: Stamp; body: EventBody };

/** An event placed on the run's one timeline (server time), with the ± bound of that place. */
export type PlacedEvent<E extends RecordedEvent = RecordedEvent> = E & { correctedMs: number; uncertaintyMs: number };

/**
 * Two events of one page lifetime whose monotonic and wall clocks disagree about the time
 * between them by more than SLEEP_TOLERANCE_MS: the wall clock was stepped (or the device
 * slept). The monotonic time is used; both are kept for the pilot or an official to judge.
 */
export type ClockStep = { deviceId: string; fromEventId: string; toEventId: string; monoMs: number; wallMs: number };

export type Estimates = ReadonlyMap<string, readonly ClockEstimate[]>;

const segmentKey = (deviceId: string, pageId: string) => `${deviceId}\u0000${pageId}`;

export type Anchor = { monoMs: number; atMs: number; uncertaintyMs: number };

/**
 * Puts every event on the run's timeline (SYNC.md §4), the same way on every screen and on
 * the server:
 * - the events one device recorded in one page lifetime keep the distances their monotonic
 *   clock measured (the input's own timestamp), so a flight timed on one phone takes its
 *   duration from that phone's steady clock, whatever its wall clock did meanwhile;
 * - the wall clock only places that page's events: its first event goes where its stamp,
 *   corrected by the device's clock offset (lib/clock correctTime), says;
 * - events of other page lifetimes (a reload) or other devices are placed by their own
 *   corrected stamps.
 * Every place where wall and monotonic disagree by more than SLEEP_TOLERANCE_MS between two
 * consecutive events of one page is returned as a ClockStep. Pure.
 */
export function placeEvents<E extends RecordedEvent>(events: readonly E[], estimates: Estimates): { events: PlacedEvent<E>[]; steps: ClockStep[] } {
  const segments = new Map<string, E[]>();
  for (const e of events) {
    const key = segmentKey(e.deviceId, e.stamp.pageId);
    const list = segments.get(key);
    if (list) list.push(e);
    else segments.set(key, [e]);
  }
  const place = new Map<string, { atMs: number; uncertaintyMs: number }>();
  const steps: ClockStep[] = [];
  for (const list of segments.values()) {
    const ordered = [...list].sort((a, b) => a.stamp.monoMs - b.stamp.monoMs || (a.seq ?? 0) - (b.seq ?? 0));
    const anchor = anchorOf(ordered[0]!, estimates);
    for (let i = 0; i < ordered.length; i++) {
      const e = ordered[i]!;
      place.set(e.id, { atMs: anchor.atMs + (e.stamp.monoMs - anchor.monoMs), uncertaintyMs: anchor.uncertaintyMs });
      const prev = ordered[i - 1];
      if (!prev) continue;
      const monoMs = e.stamp.monoMs - prev.stamp.monoMs;
      const wallMs = e.stamp.wallMs - prev.stamp.wallMs;
      if (Math.abs(wallMs - monoMs) > SLEEP_TOLERANCE_MS) steps.push({ deviceId: e.deviceId, fromEventId: prev.id, toEventId: e.id, monoMs, wallMs });
    }
  }
  const byId = new Map(events.map((e) => [e.id, e]));
  const placed = events.map((e): PlacedEvent<E> => {
    const p = place.get(e.id)!;
    if (e.body.kind !== "correct") return { ...e, correctedMs: p.atMs, uncertaintyMs: p.uncertaintyMs };
    // A correction names a wall time on the clock of the event it moves: it moves by as much
    // as that wall time differs from the event's own stamp.
    const target = byId.get(e.body.targetId);
    const shift = target ? place.get(target.id)!.atMs - target.stamp.wallMs : p.atMs - e.stamp.wallMs;
    return { ...e, body: { ...e.body, wallMs: e.body.wallMs + shift }, correctedMs: p.atMs, uncertaintyMs: p.uncertaintyMs };
  });
  return { events: placed, steps };
}

/** Where a page lifetime's first event (by steady clock, then seq) puts the page on the run's timeline. */
export function anchorOf(first: RecordedEvent, estimates: Estimates): Anchor {
  const c = correctTime(first.stamp, estimates.get(first.deviceId) ?? []);
  return { monoMs: first.stamp.monoMs, atMs: c.serverMs, uncertaintyMs: c.uncertaintyMs };
}

/**
 * Where a moment on this device (a tap being decided, or "now" on a live screen) lies on the
 * run's timeline: by the monotonic clock from this page's first event of the run, or, when
 * this page recorded none yet, by the corrected wall clock.
 */
export function placeStamp(events: readonly RecordedEvent[], estimates: Estimates, deviceId: string, stamp: Stamp): number {
  let first: RecordedEvent | null = null;
  for (const e of events) {
    if (e.deviceId !== deviceId || e.stamp.pageId !== stamp.pageId) continue;
    if (!first || e.stamp.monoMs < first.stamp.monoMs || (e.stamp.monoMs === first.stamp.monoMs && (e.seq ?? 0) < (first.seq ?? 0))) first = e;
  }
  if (first) {
    const anchor = anchorOf(first, estimates);
    return anchor.atMs + (stamp.monoMs - anchor.monoMs);
  }
  return correctTime(stamp, estimates.get(deviceId) ?? []).serverMs;
}
