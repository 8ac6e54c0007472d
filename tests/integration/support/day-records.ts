import { v7 as uuidv7 } from "uuid";
import { deriveAndStoreRuns } from "@/db/queries/runs";
import { deviceClockEstimates, devices, events, fieldSessions, laneConsents, runLanes, runs } from "@/db/schema";
import type { TaskDefinition } from "@/lib/tasks";
import { db } from "./db";
import { BEST_THREE } from "./season-records";

/** A phone: its owner, and its clock's offset θ = server − phone wall time (ms), measured with round trip δ. */
export type Phone = { id: string; ownerId: string; thetaMs: number; deltaMs: number };

export async function addPhone(ownerId: string, thetaMs: number, deltaMs: number, label: string): Promise<Phone> {
  const id = `day-${label}-${uuidv7()}`;
  await db.insert(devices).values({ id, userId: ownerId, label });
  return { id, ownerId, thetaMs, deltaMs };
}

/** Stores one clock estimate of the phone, measured `beforeMs` (true time) before `atTrueMs`. */
export async function measure(phone: Phone, atTrueMs: number): Promise<void> {
  await db.insert(deviceClockEstimates).values({ deviceId: phone.id, thetaMs: phone.thetaMs, deltaMs: phone.deltaMs, measuredAtWallMs: atTrueMs - phone.thetaMs });
}

/**
 * One phone's record in a run: the window's signals (when `signals`: one start at 0; a list: a task C
 * run's start signals, one per attempt, s after `at`) and flights per lane, [launch, landing] s after `at`.
 */
export type PhoneRecord = { phone: Phone; signals?: boolean | number[]; lanes: Record<number, [number, number][]> };

let seqs = 0;

/**
 * Stores a run as phones would have pushed it: each phone's taps stamped with its own wall clock
 * (true time − θ) and its offset, the phones' estimates in device_clock_estimates, then derived as a
 * push derives it (deriveAndStoreRuns → lib/results). `at` is the true (server) time of the window's start.
 */
export async function dayRun(input: {
  creatorId: string; field: string; at: string; pilots: string[]; records: PhoneRecord[];
  task?: TaskDefinition; consent?: { lane: number; status: "accepted" | "disputed" | "hidden" }[];
  /** Where the phone was (the session's position), when it knew. */
  position?: { latitude: number; longitude: number };
}): Promise<string> {
  const task = input.task ?? BEST_THREE;
  const startMs = Date.parse(input.at);
  const creatorPhone = input.records.find((r) => r.phone.ownerId === input.creatorId)?.phone;
  const creatorWall = startMs - (creatorPhone?.thetaMs ?? 0);
  const sessionId = uuidv7();
  const runId = uuidv7();
  await db.insert(fieldSessions).values({ id: sessionId, ownerId: input.creatorId, fieldName: input.field, startedAt: new Date(creatorWall), ...input.position });
  await db.insert(runs).values({ id: runId, sessionId, createdBy: input.creatorId, task, taskCode: task.letter ?? "custom", edition: task.edition, createdAt: new Date(creatorWall - 30_000) });
  await db.insert(runLanes).values(input.pilots.map((pilotUserId, lane) => ({ runId, lane, pilotUserId, pilotName: `Day pilot ${lane + 1}` })));
  const rows: (typeof events.$inferInsert)[] = [];
  for (const r of input.records) {
    const starts = Array.isArray(r.signals) ? r.signals : r.signals ? [0] : [];
    const taps: [number, object][] = starts.map((s) => [s * 1000, { kind: "window-start" }]);
    for (const [lane, flights] of Object.entries(r.lanes)) {
      for (const [launch, land] of flights) taps.push([launch * 1000, { kind: "launch", lane: Number(lane) }], [land * 1000, { kind: "landing", lane: Number(lane) }]);
    }
    if (starts.length > 0) taps.push([("workingTimeSec" in task ? task.workingTimeSec + 40 : Math.max(600, ...starts.map((s) => s + 240))) * 1000, { kind: "run-end" }]);
    taps.sort((a, b) => a[0] - b[0]);
    const page = `day-${runId}-${r.phone.id}`;
    for (const [offsetMs, body] of taps) {
      const trueMs = startMs + offsetMs;
      rows.push({
        id: uuidv7({ msecs: trueMs }), runId, deviceId: r.phone.id, seq: ++seqs, recordedBy: r.phone.ownerId, kind: (body as { kind: string }).kind, body,
        wallMs: trueMs - r.phone.thetaMs, monoMs: 1000 + offsetMs, pageId: page,
        offsetThetaMs: r.phone.thetaMs, offsetDeltaMs: r.phone.deltaMs, offsetMeasuredAtMs: startMs - r.phone.thetaMs - 60_000,
        correctedMs: trueMs, uncertaintyMs: r.phone.deltaMs / 2,
      });
    }
  }
  await db.insert(events).values(rows);
  for (const c of input.consent ?? []) await db.insert(laneConsents).values({ runId, lane: c.lane, pilotUserId: input.pilots[c.lane]!, status: c.status });
  await db.transaction((tx) => deriveAndStoreRuns(tx, [runId]));
  return runId;
}
