import "server-only";
import { storedOffset } from "@/lib/clock";
import { inArray, sql, type SQL } from "drizzle-orm";
import type { RunEvent } from "@/lib/events/schema";
import { eventRefusal, type RunFacts, type TargetFacts } from "@/lib/sync/authorise";
import { correctStamp, uncertaintyOf } from "@/lib/sync/correct-events";
import type { DerivationEvent } from "@/lib/sync/derive";
import { MAX_EVENTS_PER_RUN } from "@/lib/validations/sync-push";
import { events } from "../schema";
import { reject, type PushContext } from "./sync-push-entities";
import type { PushLoad } from "./sync-push-load";

/**
 * Apply pushed events: each is checked (its device, its run, the pusher's right to write it)
 * and stored once — unique id and unique (device, seq), insert … on conflict do nothing — with
 * its raw stamp and its corrected time. Reads nothing itself: the push's one load (sync-push-load.ts)
 * holds the runs, the clashing and amended events and the device's estimates; the fresh events go
 * in one insert … on conflict do nothing returning id per 500 (insertEvents: one array per column). Returns, by run, the
 * events it stored (the derivation adds them to what the load read).
 *
 * An event whose run is not on the server is refused, not held: devices send a run before its
 * events (outbox queue order), so a missing run was itself refused or never sent, and the
 * refusal says so on the device instead of waiting silently.
 */
export async function applyEvents(ctx: PushContext, items: readonly RunEvent[], load: PushLoad): Promise<Map<string, DerivationEvent[]>> {
  const added = new Map<string, DerivationEvent[]>();
  if (items.length === 0) return added;
  const { tx } = ctx;
  const fresh = checkEvents(ctx, items, load);
  for (let i = 0; i < fresh.length; i += 500) {
    const chunk = fresh.slice(i, i + 500);
    const inserted = await insertEvents(ctx.tx, chunk);
    // a conflict here is a row another transaction committed since the checks above: the same
    // event (a repeat) or an id some other event took first
    const raced = chunk.filter((row) => !inserted.has(row.id!));
    const stored = raced.length === 0 ? [] : await tx
      .select({ id: events.id, deviceId: events.deviceId, seq: events.seq })
      .from(events)
      .where(inArray(events.id, raced.map((r) => r.id!)));
    const storedById = new Map(stored.map((r) => [r.id, r]));
    for (const row of chunk) {
      if (inserted.has(row.id!)) {
        ctx.acks.push({ id: row.id!, status: "applied" });
        addTo(added, row);
        continue;
      }
      const other = storedById.get(row.id!);
      if (other && other.deviceId === row.deviceId && other.seq === row.seq) ctx.acks.push({ id: row.id!, status: "duplicate" });
      else if (other) reject(ctx, row.id!, "This event id is already used by another event.");
      else reject(ctx, row.id!, `Sequence number ${row.seq} of this device is already used by another event.`);
    }
  }

  return added;
}

const addTo = (added: Map<string, DerivationEvent[]>, row: EventInsert) => {
  const list = added.get(row.runId);
  if (list) list.push(asDerivationEvent(row));
  else added.set(row.runId, [asDerivationEvent(row)]);
};

/**
 * The pipelined push's events (db/queries/sync-push.ts): the same checks, then every fresh event acked
 * `applied` before it is stored, by ONE plain insert (no `on conflict`) that the caller sends with the
 * results: a row another transaction committed since the load makes it fail, and the push is then run
 * again the careful way (applyEvents), so such an event is still acked a duplicate or refused.
 */
export function eventsToInsert(ctx: PushContext, items: readonly RunEvent[], load: PushLoad): { insert: SQL | null; added: Map<string, DerivationEvent[]> } {
  const added = new Map<string, DerivationEvent[]>();
  if (items.length === 0) return { insert: null, added };
  const fresh = checkEvents(ctx, items, load);
  for (const row of fresh) {
    ctx.acks.push({ id: row.id!, status: "applied" });
    addTo(added, row);
  }
  return { insert: fresh.length === 0 ? null : insertEventsSql(fresh, false), added };
}

/** Each pushed event checked against the load (the refused and the duplicates acked); the rows to store. */
function checkEvents(ctx: PushContext, items: readonly RunEvent[], load: PushLoad): EventInsert[] {
  const estimates = load.estimates.get(ctx.deviceId) ?? [];
  const targetIds = items.flatMap((e) => (e.body.kind === "void" || e.body.kind === "correct" ? [e.body.targetId] : []));
  const pushedIds = new Set(items.map((e) => e.id));
  const pushedSeqs = new Set(items.map((e) => e.seq));
  const targetSet = new Set(targetIds);
  const clashes = load.stored.filter((c) => pushedIds.has(c.id) || (c.deviceId === ctx.deviceId && pushedSeqs.has(c.seq)));
  const targetRows = load.stored.filter((c) => targetSet.has(c.id));
  const runFacts = new Map<string, RunFacts>([...load.runs.values()].map((r) => [r.id, { id: r.id, createdBy: r.createdBy, lanes: r.lanes }]));
  const perRun = new Map([...load.runs.values()].map((r) => [r.id, r.eventCount]));
  const byId = new Map(clashes.map((c) => [c.id, c]));
  const bySeq = new Map(clashes.filter((c) => c.deviceId === ctx.deviceId).map((c) => [c.seq, c.id]));
  const targets = new Map<string, NonNullable<TargetFacts>>(targetRows.map((t) => [t.id, { runId: t.runId, recordedBy: t.recordedBy, deviceId: t.deviceId }]));

  const fresh: EventInsert[] = [];
  for (const e of items) {
    const stored = byId.get(e.id);
    if (stored) {
      if (stored.deviceId === e.deviceId && stored.seq === e.seq) ctx.acks.push({ id: e.id, status: "duplicate" });
      else reject(ctx, e.id, "This event id is already used by another event.");
      continue;
    }
    if (e.deviceId !== ctx.deviceId) {
      reject(ctx, e.id, "The event was recorded on another device than the one sending it.");
      continue;
    }
    if (bySeq.has(e.seq)) {
      reject(ctx, e.id, `Sequence number ${e.seq} of this device is already used by another event.`);
      continue;
    }
    const run = runFacts.get(e.runId);
    if (!run) {
      reject(ctx, e.id, "Its run is not on the server (runs are sent before their events, so the run was refused or never sent).");
      continue;
    }
    const target = "targetId" in e.body ? (targets.get(e.body.targetId) ?? null) : null;
    const refusal = eventRefusal(ctx.userId, run, e.body, target);
    if (refusal) {
      reject(ctx, e.id, refusal);
      continue;
    }
    if ((perRun.get(e.runId) ?? 0) >= MAX_EVENTS_PER_RUN) {
      reject(ctx, e.id, `The run already holds ${MAX_EVENTS_PER_RUN} events, the most one run may hold.`);
      continue;
    }
    perRun.set(e.runId, (perRun.get(e.runId) ?? 0) + 1);
    const { offset } = e.stamp;
    const corrected = correctStamp(e.stamp, estimates);
    fresh.push({
      id: e.id, runId: e.runId, deviceId: e.deviceId, seq: e.seq, recordedBy: ctx.userId, kind: e.body.kind, body: e.body,
      wallMs: e.stamp.wallMs, monoMs: e.stamp.monoMs, pageId: e.stamp.pageId,
      offsetThetaMs: offset?.thetaMs ?? null, offsetDeltaMs: offset?.deltaMs ?? null, offsetMeasuredAtMs: offset?.measuredAtWallMs ?? null,
      correctedMs: corrected.correctedMs, uncertaintyMs: corrected.uncertaintyMs,
    });
    // later items of this push may amend it or clash with it
    byId.set(e.id, { id: e.id, deviceId: e.deviceId, seq: e.seq, runId: e.runId, recordedBy: ctx.userId });
    bySeq.set(e.seq, e.id);
    targets.set(e.id, { runId: e.runId, recordedBy: ctx.userId });
  }
  return fresh;
}

/** An inserted row as the derivation reads it (the same shape loadForPush gives stored ones). */
function asDerivationEvent(row: typeof events.$inferInsert): DerivationEvent {
  const offset = storedOffset(row.offsetThetaMs, row.offsetDeltaMs, row.offsetMeasuredAtMs);
  return {
    id: row.id!, deviceId: row.deviceId, seq: row.seq, recordedBy: row.recordedBy, body: row.body as DerivationEvent["body"],
    stamp: { wallMs: row.wallMs, monoMs: row.monoMs, pageId: row.pageId, offset },
    correctedMs: row.correctedMs, uncertaintyMs: uncertaintyOf(row.uncertaintyMs ?? null),
  };
}

type EventInsert = typeof events.$inferInsert;

/**
 * Insert rows into events … on conflict do nothing, returning the ids stored: ONE statement with
 * one array parameter per column (unnest), so neither the query text nor the parameter count
 * grows with the rows (a multi-row VALUES list has 15 parameters per row to build and bind).
 */
async function insertEvents(tx: PushContext["tx"], rows: readonly EventInsert[]): Promise<Set<string>> {
  const res = await tx.execute<{ id: string }>(insertEventsSql(rows, true));
  return new Set(res.rows.map((r) => r.id));
}

/** The insert of insertEvents; `onConflict` false: plain, so any clash fails the statement. */
function insertEventsSql(rows: readonly EventInsert[], onConflict: boolean): SQL {
  const col = <T>(pick: (r: EventInsert) => T) => sql.param(rows.map(pick));
  return sql`
    insert into events (id, run_id, device_id, seq, recorded_by, kind, body, wall_ms, mono_ms, page_id,
      offset_theta_ms, offset_delta_ms, offset_measured_at_ms, corrected_ms, uncertainty_ms)
    select id, run_id, device_id, seq, recorded_by, kind, body::jsonb, wall_ms, mono_ms, page_id,
      offset_theta_ms, offset_delta_ms, offset_measured_at_ms, corrected_ms, uncertainty_ms
    from unnest(${col((r) => r.id)}::uuid[], ${col((r) => r.runId)}::uuid[], ${col((r) => r.deviceId)}::text[], ${col((r) => r.seq)}::int[],
      ${col((r) => r.recordedBy)}::uuid[], ${col((r) => r.kind)}::text[], ${col((r) => JSON.stringify(r.body))}::text[],
      ${col((r) => r.wallMs)}::float8[], ${col((r) => r.monoMs)}::float8[], ${col((r) => r.pageId)}::text[],
      ${col((r) => r.offsetThetaMs ?? null)}::float8[], ${col((r) => r.offsetDeltaMs ?? null)}::float8[], ${col((r) => r.offsetMeasuredAtMs ?? null)}::float8[],
      ${col((r) => r.correctedMs)}::float8[], ${col((r) => r.uncertaintyMs ?? null)}::float8[])
      as v(id, run_id, device_id, seq, recorded_by, kind, body, wall_ms, mono_ms, page_id,
        offset_theta_ms, offset_delta_ms, offset_measured_at_ms, corrected_ms, uncertainty_ms)
    ${onConflict ? sql`on conflict do nothing` : sql``}
    returning id::text`;
}
