/**
 * Browser side of bench/tap.bench.ts (bundled by it): two buttons pressed by real input.
 * #tap runs the field timer's write path — stamp from the input's own timeStamp, decide
 * launch/landing from the stored events, recordEvent (event + outbox + counters in one
 * Dexie transaction); #raw puts the same record with a bare IndexedDB put. Each latency
 * is from the input event's timeStamp to the committed write.
 */
import { v7 as uuidv7 } from "uuid";
import type { RunEvent } from "@/lib/events/schema";
import { tapKindFor } from "@/lib/field/lane-tap";
import { placedTimeline } from "@/lib/offline/run-result";
import { createWindowcallDb } from "@/lib/offline/db";
import { getDeviceId, stampFromInput } from "@/lib/offline/device";
import { createRunLocal, createSessionLocal, recordEvent } from "@/lib/offline/record";
import { getCatalogueTask } from "@/lib/tasks";

const TAPS_PER_RUN = 40; // about one task window of taps; a new run after that
const task = getCatalogueTask("H");
const db = createWindowcallDb("windowcall-tap-bench");
const results = { tap: [] as number[], raw: [] as number[], errors: [] as string[] };
let runId = "";
let events: RunEvent[] = [];
let deviceId = "";
let queue: Promise<unknown> = Promise.resolve();

async function newRun() {
  const session = await createSessionLocal(db, { ownerId: "bench", fieldName: "Bench", conditions: {}, startedAtWallMs: Date.now() });
  const run = await createRunLocal(db, { sessionId: session.id, task, lanes: [{ lane: 0, pilotName: "Bench" }], createdAtWallMs: Date.now() });
  runId = run.id;
  events = [await recordEvent(db, { runId, body: { kind: "window-start" }, stamp: stampFromInput(performance.now(), null) })];
}

function openRaw(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const req = indexedDB.open("windowcall-tap-bench-raw", 1);
    req.onupgradeneeded = () => req.result.createObjectStore("events", { keyPath: "id" });
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error);
  });
}

async function setup() {
  deviceId = await getDeviceId(db);
  await newRun();
  const raw = await openRaw();
  const tap = document.getElementById("tap")!;
  tap.addEventListener("pointerdown", (e) => {
    const t0 = e.timeStamp;
    const stamp = stampFromInput(t0, null);
    queue = queue.then(async () => {
      const view = { deviceId, me: null, estimate: null };
      const kind = tapKindFor(placedTimeline(events, view), 0, 1);
      events.push(await recordEvent(db, { runId, body: { kind, lane: 0 }, stamp }));
      results.tap.push(performance.now() - t0);
      if (events.length > TAPS_PER_RUN) await newRun();
    }).catch((err: unknown) => results.errors.push(String(err)));
  });
  const rawButton = document.getElementById("raw")!;
  rawButton.addEventListener("pointerdown", (e) => {
    const t0 = e.timeStamp;
    const template = events[events.length - 1]!;
    const record = { ...template, id: uuidv7(), stamp: stampFromInput(t0, null) };
    const tx = raw.transaction("events", "readwrite");
    tx.objectStore("events").put(record);
    tx.oncomplete = () => results.raw.push(performance.now() - t0);
  });
}

Object.assign(window, { benchReady: setup(), benchResults: results });
