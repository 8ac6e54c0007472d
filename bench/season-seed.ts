/**
 * The season bench's data: one pilot with RUNS runs of FLIGHTS flights each (5,000 × 6 = 30,000),
 * stored as a phone pushes them (events) and derived as the server derives them (deriveAndStoreRuns
 * → lib/results), over 2026, spread across catalogue tasks that allow that many launches.
 */
import { v7 as uuidv7 } from "uuid";
import { db } from "@/db";
import { deriveAndStoreRuns } from "@/db/queries/runs";
import { events, fieldSessions, runLanes, runs, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { mulberry32 } from "@/lib/random";
import { getCatalogueTask, type TaskDefinition, type TaskLetter } from "@/lib/tasks";

const LETTERS: TaskLetter[] = ["A", "B", "D", "F", "G", "H", "I", "J", "K", "L", "M", "N"];
const DAY = 24 * 3600 * 1000;

/** Catalogue tasks with a working time of 10 minutes or more (so six flights fit); any launch limit. */
function roomyTasks(): TaskDefinition[] {
  return LETTERS.map((l) => getCatalogueTask(l)).filter((t) => t.kind === "window" && t.workingTimeSec >= 600);
}

export async function seedBenchSeason(input: { runs: number; flights: number; password: string }) {
  const email = `season-bench-${Date.now()}@example.com`;
  const [pilot] = await db.insert(users).values({ email, name: "Bench Pilot", passwordHash: await hashPassword(input.password) }).returning();
  const pilotId = pilot!.id;
  const random = mulberry32(20261204);
  const tasks = roomyTasks();
  const perSession = 20;
  const deviceId = `season-bench-${uuidv7()}`;
  let seq = 0;
  for (let s = 0; s * perSession < input.runs; s++) {
    const startMs = Date.UTC(2026, 0, 3, 9) + Math.floor((s * 360 * DAY) / Math.ceil(input.runs / perSession));
    const sessionId = uuidv7({ msecs: startMs });
    await db.insert(fieldSessions).values({ id: sessionId, ownerId: pilotId, fieldName: s % 3 ? "Bench Meadow" : "Bench Ridge", startedAt: new Date(startMs) });
    const runRows: (typeof runs.$inferInsert & { id: string })[] = [];
    const eventRows: (typeof events.$inferInsert)[] = [];
    for (let r = 0; r < perSession && s * perSession + r < input.runs; r++) {
      const task = tasks[Math.floor(random() * tasks.length)]!;
      const runStart = startMs + r * 15 * 60_000;
      const runId = uuidv7({ msecs: runStart });
      runRows.push({ id: runId, sessionId, createdBy: pilotId, task, taskCode: task.letter ?? "custom", edition: task.edition, createdAt: new Date(runStart) });
      const taps: [number, object][] = [[0, { kind: "window-start" }]];
      let t = 3000;
      for (let f = 0; f < input.flights; f++) {
        const flown = Math.round(40_000 + random() * 50_000);
        taps.push([t, { kind: "launch", lane: 0 }], [t + flown, { kind: "landing", lane: 0 }]);
        t += flown + Math.round(1500 + random() * 6000);
      }
      taps.push([Math.max(t, 700_000), { kind: "run-end" }]);
      for (const [at, body] of taps) {
        seq += 1;
        eventRows.push({
          id: uuidv7({ msecs: runStart + at }), runId, deviceId, seq, recordedBy: pilotId, kind: (body as { kind: string }).kind, body,
          wallMs: runStart + at, monoMs: at + 1000, pageId: `bench-${runId}`, correctedMs: runStart + at, uncertaintyMs: 10,
        });
      }
    }
    await db.insert(runs).values(runRows);
    await db.insert(runLanes).values(runRows.map((r) => ({ runId: r.id, lane: 0, pilotUserId: pilotId, pilotName: "Bench Pilot" })));
    for (let i = 0; i < eventRows.length; i += 1000) await db.insert(events).values(eventRows.slice(i, i + 1000));
    await db.transaction((tx) => deriveAndStoreRuns(tx, runRows.map((r) => r.id)));
  }
  return { pilotId, email };
}
