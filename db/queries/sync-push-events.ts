import "server-only";
import { and, eq, inArray, or, sql } from "drizzle-orm";
import type { ClockEstimate } from "@/lib/clock";
import type { RunEvent } from "@/lib/events/schema";
import { eventRefusal, type RunFacts, type TargetFacts } from "@/lib/sync/authorise";
import { correctStamp } from "@/lib/sync/correct-events";
import { MAX_EVENTS_PER_RUN } from "@/lib/validations/sync-push";
import { events } from "../schema";
import { reject, type PushContext } from "./sync-push-entities";

/**
 * Apply pushed events: each is checked (its device, its run, the pusher's right to write it)
 * and stored once — unique id and unique (device, seq), insert … on conflict do nothing — with
 * its raw stamp and its corrected time. Returns the runs that got new events.
 *
 * An event whose run is not on the server is refused, not held: devices send a run before its
 * events (outbox queue order), so a missing run was itself refused or never sent, and the
 * refusal says so on the device instead of waiting silently.
 */
export async function applyEvents(ctx: PushContext, items: readonly RunEvent[], estimates: readonly ClockEstimate[]): Promise<Set<string>> {
  const touched = new Set<string>();
  if (items.length === 0) return touched;
  const { tx } = ctx;
  const runIds = [...new Set(items.map((e) => e.runId))];
  const targetIds = items.flatMap((e) => (e.body.kind === "void" || e.body.kind === "correct" ? [e.body.targetId] : []));
  // one connection: queries in a transaction run one after another, so few of them
  const facts = await tx.execute<{ id: string; created_by: string; lanes: { lane: number; pilotUserId: string | null }[] | null; n: number }>(sql`
    select r.id, r.created_by,
      (select json_agg(json_build_object('lane', l.lane, 'pilotUserId', l.pilot_user_id)) from run_lanes l where l.run_id = r.id) as lanes,
      (select count(*)::int from events e where e.run_id = r.id) as n
    from runs r where r.id in (${sql.join(runIds.map((id) => sql`${id}::uuid`), sql`, `)})`);
  const stored = await tx
    .select({ id: events.id, deviceId: events.deviceId, seq: events.seq, runId: events.runId, recordedBy: events.recordedBy })
    .from(events)
    .where(
      or(
        inArray(events.id, [...new Set([...items.map((e) => e.id), ...targetIds])]),
        and(eq(events.deviceId, ctx.deviceId), inArray(events.seq, items.map((e) => e.seq))),
      ),
    );
  const pushedIds = new Set(items.map((e) => e.id));
  const pushedSeqs = new Set(items.map((e) => e.seq));
  const targetSet = new Set(targetIds);
  const clashes = stored.filter((c) => pushedIds.has(c.id) || (c.deviceId === ctx.deviceId && pushedSeqs.has(c.seq)));
  const targetRows = stored.filter((c) => targetSet.has(c.id));
  const runFacts = new Map<string, RunFacts>(facts.rows.map((r) => [r.id, { id: r.id, createdBy: r.created_by, lanes: r.lanes ?? [] }]));
  const perRun = new Map(facts.rows.map((r) => [r.id, Number(r.n)]));
  const byId = new Map(clashes.map((c) => [c.id, c]));
  const bySeq = new Map(clashes.filter((c) => c.deviceId === ctx.deviceId).map((c) => [c.seq, c.id]));
  const targets = new Map<string, NonNullable<TargetFacts>>(targetRows.map((t) => [t.id, { runId: t.runId, recordedBy: t.recordedBy }]));

  const fresh: (typeof events.$inferInsert)[] = [];
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
  for (let i = 0; i < fresh.length; i += 500) {
    const chunk = fresh.slice(i, i + 500);
    const inserted = new Set(
      (await tx.insert(events).values(chunk).onConflictDoNothing().returning({ id: events.id })).map((r) => r.id),
    );
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
        touched.add(row.runId);
        continue;
      }
      const other = storedById.get(row.id!);
      if (other && other.deviceId === row.deviceId && other.seq === row.seq) ctx.acks.push({ id: row.id!, status: "duplicate" });
      else if (other) reject(ctx, row.id!, "This event id is already used by another event.");
      else reject(ctx, row.id!, `Sequence number ${row.seq} of this device is already used by another event.`);
    }
  }
  return touched;
}
