import { v7 as uuidv7 } from "uuid";
import type { ClockEstimate } from "@/lib/clock";
import type { EventBody, RunEvent } from "@/lib/events/schema";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import { getCatalogueTask } from "@/lib/tasks";
import type { PushReply, PushRequest } from "@/lib/validations/sync";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { actAs, type MockSessionUser } from "./support/session";

/** Builders and route calls shared by the sync integration tests. */

export function pushRequest(body: unknown): Request {
  return new Request("http://test/api/sync/push", { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } });
}

export async function push(body: PushRequest | Record<string, unknown>): Promise<{ status: number; body: PushReply & { error?: { code: string } } }> {
  const res = await pushRoute(pushRequest(body));
  return { status: res.status, body: await res.json() };
}

export async function pull(cursor: number | string) {
  const res = await pullRoute(new Request(`http://test/api/sync/pull?cursor=${cursor}`));
  return { status: res.status, body: await res.json() };
}

export const deviceId = () => `test-device-${uuidv7()}`;

export function session(ownerId: string, extra: Partial<SessionEntity> = {}): SessionEntity {
  return { id: uuidv7(), ownerId, fieldName: "Test Meadow", conditions: { windMs: 3 }, startedAtWallMs: 1_767_000_000_000, ...extra };
}

export function run(sessionId: string, lanes: RunEntity["lanes"], task: Record<string, unknown> = getCatalogueTask("H")): RunEntity {
  return { id: uuidv7(), sessionId, task, lanes, createdAtWallMs: 1_767_000_060_000 };
}

/**
 * A device that records events with a clock `thetaMs` behind the server (server = wall + θ)
 * and carries the estimate `estimate` (null: never measured). `at(trueMs)` is server time.
 */
export function recorder(id: string, opts: { thetaMs?: number; estimate?: ClockEstimate | null } = {}) {
  const thetaMs = opts.thetaMs ?? 0;
  const estimate = opts.estimate === undefined ? { thetaMs, deltaMs: 20, measuredAtWallMs: 1_767_000_000_000 - thetaMs } : opts.estimate;
  let seq = 0;
  return {
    id,
    at(runId: string, trueMs: number, body: EventBody, offset: ClockEstimate | null = estimate): RunEvent {
      return { id: uuidv7(), runId, deviceId: id, seq: ++seq, stamp: { wallMs: trueMs - thetaMs, monoMs: trueMs, pageId: `page-${id}`, offset }, body };
    },
    /** Launch and landing events for flights of `secs`, back to back from `fromMs`, 1 s between. */
    flights(runId: string, lane: number, secs: readonly number[], fromMs: number): RunEvent[] {
      const out: RunEvent[] = [];
      let t = fromMs;
      for (const s of secs) {
        out.push(this.at(runId, t, { kind: "launch", lane }));
        t += s * 1000;
        out.push(this.at(runId, t, { kind: "landing", lane }));
        t += 1000;
      }
      return out;
    },
  };
}

/**
 * "Push as this user": acts as `user` (the mocked session) with a fresh phone, a field session of
 * theirs and a run in it (by default `user` flies lane 0 alone). `send(events, more)` pushes the
 * session, the run and the events from that phone; `more` adds or replaces envelope fields.
 */
export function pushingAs(user: MockSessionUser, lanes?: RunEntity["lanes"]) {
  actAs(user);
  const phone = recorder(deviceId());
  const s = session(user.id);
  const r = run(s.id, lanes ?? [{ lane: 0, pilotName: user.name, pilotUserId: user.id }]);
  // events may be malformed on purpose: the server is what judges them
  const send = (events: readonly unknown[] = [], more: Record<string, unknown> = {}) => push({ deviceId: phone.id, sessions: [s], runs: [r], events, ...more });
  return { phone, session: s, run: r, send };
}

export const T0 = 1_767_000_100_000; // a working-time signal, on the server clock
