import { v7 as uuidv7 } from "uuid";
import type { Tx } from "../queries/sync-db";
import { devices, events, fieldSessions, runLanes, runs } from "../schema";
import { makeRandom, pickTask, simulateWindow } from "./simulate";

type Person = { id: string; name: string; skill: number };

/**
 * A club evening after the season where Tobi held the watch for Ada: two runs recorded for her
 * on his phone, waiting for her to accept them (README "Runs recorded for you"). The second
 * carries a penalty Tobi gave, which counts nothing: he is no contest official. Tobi also timed
 * that second window on his own phone (`backupDeviceId`) as a backup: each tap 0.4 s late, and he
 * missed Ada's last flight on it, so the Day board lists the lane as recorded differently by two
 * phones, side by side for an officer's decision. (Only the run's creator or its pilots may push
 * events into a run: lib/sync/authorise.ts.)
 */
export async function seedRecordedFor(tx: Tx, p: { clubId: string; field: string; startedAt: number; keeper: Person; pilot: Person; backupDeviceId?: string }) {
  const random = makeRandom(20261121);
  const deviceId = "demo-phone-tobi-club";
  await tx.insert(devices).values({ id: deviceId, userId: p.keeper.id, label: `${p.keeper.name}'s club timing phone` });
  const sessionId = uuidv7({ msecs: p.startedAt });
  await tx.insert(fieldSessions).values({
    id: sessionId, ownerId: p.keeper.id, clubId: p.clubId, fieldName: p.field,
    conditions: { windMs: 2.4, gustMs: 3.8, temperatureC: 9, notes: "Club evening: timing each other" }, startedAt: new Date(p.startedAt),
  });
  let seq = 0;
  for (let r = 0; r < 2; r++) {
    const task = pickTask(random);
    const runStart = p.startedAt + r * 25 * 60_000;
    const runId = uuidv7({ msecs: runStart });
    await tx.insert(runs).values({
      id: runId, sessionId, createdBy: p.keeper.id, task, taskCode: task.letter ?? "custom", edition: task.edition, createdAt: new Date(runStart - 60_000),
    });
    await tx.insert(runLanes).values({ runId, lane: 0, pilotUserId: p.pilot.id, pilotName: p.pilot.name });
    const taps = simulateWindow(task, p.pilot.skill, random);
    if (r === 1) taps.push({ atOffsetMs: (taps.at(-1)?.atOffsetMs ?? 0) + 5000, body: { kind: "penalty", lane: 0, points: 100, reason: "Launched outside the launch area" } });
    if (r === 1 && p.backupDeviceId) {
      const lane = taps.filter((t) => t.body.kind === "launch" || t.body.kind === "landing");
      const lastLaunch = lane.findLastIndex((t) => t.body.kind === "launch");
      const backup = p.backupDeviceId;
      await tx.insert(events).values(
        lane.slice(0, lastLaunch).map((tap, i) => {
          const wallMs = runStart + tap.atOffsetMs + 400;
          return {
            id: uuidv7({ msecs: wallMs }), runId, deviceId: backup, seq: 100_000 + r * 1000 + i, recordedBy: p.keeper.id, kind: tap.body.kind, body: tap.body,
            wallMs, monoMs: tap.atOffsetMs + 1400, pageId: `demo-${runId}-backup`,
            offsetThetaMs: 0, offsetDeltaMs: 30, offsetMeasuredAtMs: runStart - 90_000, correctedMs: wallMs, uncertaintyMs: 15,
          };
        }),
      );
    }
    await tx.insert(events).values(
      taps.map((tap) => {
        const wallMs = runStart + tap.atOffsetMs;
        seq += 1;
        return {
          id: uuidv7({ msecs: wallMs }), runId, deviceId, seq, recordedBy: p.keeper.id, kind: tap.body.kind, body: tap.body,
          wallMs, monoMs: tap.atOffsetMs + 1000, pageId: `demo-${runId}`,
          offsetThetaMs: 0, offsetDeltaMs: 24, offsetMeasuredAtMs: runStart - 120_000, correctedMs: wallMs, uncertaintyMs: 12,
        };
      }),
    );
  }
}
