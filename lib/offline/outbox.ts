import { runEventSchema, type RunEvent } from "@/lib/events/schema";
import type { Ack } from "@/lib/validations/sync";
import type { OutboxEntry, WindowcallDb } from "./db";
import { runEntitySchema, sessionEntitySchema, type RunDiscard, type RunEntity, type SessionEntity } from "@/lib/events/entities";

/** Outbox entries waiting to be sent (not rejected), in queue order. */
export async function listPending(db: WindowcallDb, limit: number): Promise<OutboxEntry[]> {
  return db.outbox.orderBy("queueSeq").filter((e) => !e.rejected).limit(limit).toArray();
}

/** How many items are waiting to be sent (rejected ones excluded). */
export async function countUnsent(db: WindowcallDb): Promise<number> {
  return db.outbox.filter((e) => !e.rejected).count();
}

/** Items the server (or the device) refused, with the reason, in queue order. */
export async function listRejected(db: WindowcallDb): Promise<{ id: string; kind: OutboxEntry["kind"]; reason: string }[]> {
  const rows = await db.outbox.orderBy("queueSeq").filter((e) => !!e.rejected).toArray();
  return rows.map((e) => ({ id: e.id, kind: e.kind, reason: e.rejected!.reason }));
}

export type PushPayload = { sessions: SessionEntity[]; runs: RunEntity[]; events: RunEvent[]; discards?: RunDiscard[] };

/** Bytes of items one push carries at most: well under the server's 1 MB cap (lib/api.ts). */
export const PUSH_MAX_BYTES = 768 * 1024;

/**
 * The records behind outbox entries, checked with the protocol's schemas. An entry whose
 * record is missing or fails validation is returned in `invalid`: it would fail on the
 * server every time, so it is rejected locally rather than blocking everything behind it.
 * Stops before the items would pass `maxBytes` (the rest go in the next push).
 */
export async function loadPayload(
  db: WindowcallDb,
  entries: readonly OutboxEntry[],
  maxBytes = PUSH_MAX_BYTES,
): Promise<{ payload: PushPayload; sentIds: string[]; invalid: { id: string; reason: string }[] }> {
  const payload: PushPayload = { sessions: [], runs: [], events: [] };
  const sentIds: string[] = [];
  const invalid: { id: string; reason: string }[] = [];
  let bytes = 0;
  for (const entry of entries) {
    if (entry.kind === "discard") {
      // a deleted window: nothing left on the device but its id
      (payload.discards ??= []).push({ id: entry.id });
      sentIds.push(entry.id);
      continue;
    }
    const table = entry.kind === "event" ? db.events : entry.kind === "session" ? db.sessions : db.runs;
    const schema = entry.kind === "event" ? runEventSchema : entry.kind === "session" ? sessionEntitySchema : runEntitySchema;
    const record: unknown = await table.get(entry.id);
    if (record === undefined) {
      invalid.push({ id: entry.id, reason: `the ${entry.kind} is missing on this device` });
      continue;
    }
    const parsed = schema.safeParse(record);
    if (!parsed.success) {
      invalid.push({ id: entry.id, reason: `invalid ${entry.kind}: ${parsed.error.issues[0]?.message ?? "?"}` });
      continue;
    }
    const size = new TextEncoder().encode(JSON.stringify(parsed.data)).length;
    if (sentIds.length > 0 && bytes + size > maxBytes) break;
    bytes += size;
    if (entry.kind === "event") payload.events.push(parsed.data as RunEvent);
    else if (entry.kind === "session") payload.sessions.push(parsed.data as SessionEntity);
    else payload.runs.push(parsed.data as RunEntity);
    sentIds.push(entry.id);
  }
  return { payload, sentIds, invalid };
}

/** Mark entries refused for good: kept with their reason, never sent again. */
export async function markRejected(db: WindowcallDb, items: readonly { id: string; reason: string }[]): Promise<void> {
  await db.transaction("rw", db.outbox, async () => {
    for (const { id, reason } of items) await db.outbox.update(id, { rejected: { reason }, lastError: reason });
  });
}

/** Count a failed attempt on each entry, keeping the error for display. */
export async function markAttemptFailed(db: WindowcallDb, ids: readonly string[], error: string): Promise<void> {
  await db.transaction("rw", db.outbox, async () => {
    for (const id of ids) await db.outbox.where("id").equals(id).modify((e) => {
      e.attempts += 1;
      e.lastError = error;
    });
  });
}

/**
 * Apply the server's acks to the entries just sent: applied/duplicate entries are deleted
 * (the server has them), rejected ones are kept with the reason. Acks for ids that were not
 * in this push, and repeated acks, are ignored. Returns the sent ids the server answered
 * for, and how many of them it accepted and rejected.
 */
export async function applyAcks(
  db: WindowcallDb,
  sentIds: readonly string[],
  acks: readonly Ack[],
): Promise<{ answered: Set<string>; accepted: number; rejected: number }> {
  const sent = new Set(sentIds);
  const answered = new Set<string>();
  let accepted = 0;
  let rejected = 0;
  await db.transaction("rw", db.outbox, async () => {
    for (const ack of acks) {
      if (!sent.has(ack.id) || answered.has(ack.id)) continue;
      answered.add(ack.id);
      if (ack.status === "rejected") {
        const reason = ack.reason ?? "rejected by the server";
        await db.outbox.update(ack.id, { rejected: { reason }, lastError: reason });
        rejected += 1;
      } else {
        await db.outbox.delete(ack.id);
        accepted += 1;
      }
    }
  });
  return { answered, accepted, rejected };
}
