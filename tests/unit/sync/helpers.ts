import type { ClockEstimate } from "@/lib/clock";
import type { EventBody } from "@/lib/events/schema";
import { correctStamp, uncertaintyOf } from "@/lib/sync/correct-events";
import type { DerivationEvent } from "@/lib/sync/types";

let n = 0;
/** A UUID-shaped id, increasing. */
export const nextId = () => `00000000-0000-7000-8000-${String(++n).padStart(12, "0")}`;

/**
 * One device for derivation tests: its user, its clock (server time = device wall time +
 * `thetaMs`) and the estimate it measured (θ exact, δ = 2 × `boundMs`). `at(trueMs, body)`
 * records an event at a true (server) time, corrected the way the server stores it.
 */
export function device(deviceId: string, recordedBy: string, opts: { thetaMs?: number; boundMs?: number; measured?: boolean } = {}) {
  const thetaMs = opts.thetaMs ?? 0;
  const estimate: ClockEstimate | null =
    opts.measured === false ? null : { thetaMs, deltaMs: 2 * (opts.boundMs ?? 20), measuredAtWallMs: -thetaMs };
  let seq = 0;
  const events: DerivationEvent[] = [];
  return {
    deviceId,
    estimates: estimate ? [estimate] : [],
    events,
    at(trueMs: number, body: EventBody): DerivationEvent {
      const stamp = { wallMs: trueMs - thetaMs, monoMs: trueMs, pageId: `page-${deviceId}`, offset: estimate };
      const c = correctStamp(stamp, estimate ? [estimate] : []);
      const e = { id: nextId(), deviceId, seq: ++seq, recordedBy, stamp, body, correctedMs: c.correctedMs, uncertaintyMs: uncertaintyOf(c.uncertaintyMs) };
      events.push(e);
      return e;
    },
    /** Launch/landing pairs for `secs` flown back to back from `startMs`, 1 s on the ground between. */
    flights(lane: number, secs: readonly number[], startMs = 0, gapMs = 1000): void {
      let t = startMs;
      for (const s of secs) {
        this.at(t, { kind: "launch", lane });
        t += s * 1000;
        this.at(t, { kind: "landing", lane });
        t += gapMs;
      }
    },
  };
}

export type TestDevice = ReturnType<typeof device>;

/** Estimates map for deriveRun. */
export const estimatesOf = (...devices: TestDevice[]) => new Map(devices.map((d) => [d.deviceId, d.estimates]));
