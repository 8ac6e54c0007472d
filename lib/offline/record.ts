import { v7 as uuidv7 } from "uuid";
import { clockEstimateSchema, runEventSchema, type EventBody, type RunEvent, type Stamp } from "@/lib/events/schema";
import { getMeta, setMeta, type OutboxKind, type WindowcallDb } from "./db";
import { getDeviceId } from "./device";
import { runEntitySchema, sessionEntitySchema, type RunEntity, type SessionEntity } from "@/lib/events/entities";

/**
 * Local writes (SYNC.md §2): every write puts the record AND its outbox entry in one Dexie
 * transaction before returning, so a killed tab leaves both or neither. Input is validated
 * inside the transaction: bad input throws and changes nothing.
 */

type Options = { now?: () => number };

/** Take the next value of a meta counter (starting at 1); call inside a rw transaction on meta. */
async function takeCounter(db: WindowcallDb, key: "nextSeq" | "nextQueueSeq"): Promise<number> {
  const value = (await getMeta(db, key)) ?? 1;
  await setMeta(db, key, value + 1);
  return value;
}

export async function enqueue(db: WindowcallDb, id: string, kind: OutboxKind, createdAt: number): Promise<void> {
  const queueSeq = await takeCounter(db, "nextQueueSeq");
  await db.outbox.add({ id, kind, createdAt, queueSeq, attempts: 0 });
}

/**
 * Record one event of a run: allocates the next per-device seq, writes the event and its
 * outbox entry atomically, and returns the stored event. It is a tap's whole path to storage,
 * so the reads (device id, both counters) are issued together, then the four writes together:
 * the same requests in one transaction, without a round trip to the page between each.
 */
export async function recordEvent(
  db: WindowcallDb,
  input: { runId: string; body: EventBody; stamp: Stamp },
  options: Options = {},
): Promise<RunEvent> {
  const now = options.now ?? Date.now;
  return db.transaction("rw", [db.events, db.outbox, db.meta], async () => {
    const [storedDeviceId, nextSeq, nextQueueSeq] = await Promise.all([getMeta(db, "deviceId"), getMeta(db, "nextSeq"), getMeta(db, "nextQueueSeq")]);
    const deviceId = storedDeviceId ?? (await getDeviceId(db));
    const seq = nextSeq ?? 1;
    const queueSeq = nextQueueSeq ?? 1;
    // an offset the protocol cannot carry (an absurd exchange) must not cost the tap: record it without
    const offset = input.stamp.offset && clockEstimateSchema.safeParse(input.stamp.offset).success ? input.stamp.offset : null;
    const stamp = { ...input.stamp, offset };
    const event = runEventSchema.parse({ id: uuidv7(), runId: input.runId, deviceId, seq, stamp, body: input.body });
    await Promise.all([
      setMeta(db, "nextSeq", seq + 1),
      db.events.add(event),
      setMeta(db, "nextQueueSeq", queueSeq + 1),
      db.outbox.add({ id: event.id, kind: "event", createdAt: now(), queueSeq, attempts: 0 }),
    ]);
    return event;
  });
}

/** Create a field session on the device (entity + outbox entry, one transaction). */
export async function createSessionLocal(
  db: WindowcallDb,
  input: Omit<SessionEntity, "id">,
  options: Options = {},
): Promise<SessionEntity> {
  const now = options.now ?? Date.now;
  return db.transaction("rw", [db.sessions, db.outbox, db.meta], async () => {
    const session = sessionEntitySchema.parse({ ...input, id: uuidv7() });
    await db.sessions.add(session);
    await enqueue(db, session.id, "session", now());
    return session;
  });
}

/** Create a run in a session on the device (entity + outbox entry, one transaction). */
export async function createRunLocal(
  db: WindowcallDb,
  input: Omit<RunEntity, "id">,
  options: Options = {},
): Promise<RunEntity> {
  const now = options.now ?? Date.now;
  return db.transaction("rw", [db.runs, db.outbox, db.meta], async () => {
    const run = runEntitySchema.parse({ ...input, id: uuidv7() });
    await db.runs.add(run);
    await enqueue(db, run.id, "run", now());
    return run;
  });
}
