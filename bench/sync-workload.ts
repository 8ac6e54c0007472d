import { v7 as uuidv7 } from "uuid";
import type { RunEvent } from "@/lib/events/schema";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import { getCatalogueTask } from "@/lib/tasks";
import type { PushRequest } from "@/lib/validations/sync";

/**
 * One device's pushes: a session, `runs` runs and `perRun` events each (a window start, then
 * alternating launches and landings a minute apart), in requests of at most `batch` items,
 * in the order the outbox would send them. `day`: that many days later (the server takes at most MAX_RUNS_PER_DAY
 * runs of one account per day).
 */
export function deviceWorkload(userId: string, runs: number, perRun: number, batch: number, day = 0): PushRequest[] {
  const deviceId = `bench-${uuidv7()}`;
  const at = 1_767_000_000_000 + day * 86_400_000;
  const estimate = { thetaMs: 120, deltaMs: 30, measuredAtWallMs: at };
  const session: SessionEntity = { id: uuidv7(), ownerId: userId, fieldName: "Bench field", conditions: {}, startedAtWallMs: at };
  const items: ({ kind: "session"; v: SessionEntity } | { kind: "run"; v: RunEntity } | { kind: "event"; v: RunEvent })[] = [
    { kind: "session", v: session },
  ];
  let seq = 0;
  for (let r = 0; r < runs; r++) {
    const run: RunEntity = {
      id: uuidv7(), sessionId: session.id, task: getCatalogueTask("H"),
      lanes: [{ lane: 0, pilotName: "Bench pilot", pilotUserId: userId }], createdAtWallMs: at + r,
    };
    items.push({ kind: "run", v: run });
    const t0 = at + 100_000 + r * 3_600_000;
    for (let i = 0; i < perRun; i++) {
      const body: RunEvent["body"] = i === 0 ? { kind: "window-start" } : { kind: i % 2 === 1 ? "launch" : "landing", lane: 0 };
      items.push({
        kind: "event",
        v: { id: uuidv7(), runId: run.id, deviceId, seq: ++seq, stamp: { wallMs: t0 + i * 60_000, monoMs: i * 60_000, pageId: "bench", offset: estimate }, body },
      });
    }
  }
  const out: PushRequest[] = [];
  for (let i = 0; i < items.length; i += batch) {
    const req: PushRequest = { deviceId, sessions: [], runs: [], events: [] };
    for (const it of items.slice(i, i + batch)) {
      if (it.kind === "session") req.sessions.push(it.v);
      else if (it.kind === "run") req.runs.push(it.v);
      else req.events.push(it.v);
    }
    out.push(req);
  }
  return out;
}

/** The percentile `p` (0–1) of sorted numbers. */
export function percentile(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))]!;
}
