import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { RunEvent } from "@/lib/events/schema";
import type { Database } from "../index";
import { contestEntries, contestReflightRequests, users } from "../schema";
import { grantReflight } from "./contest-reflights";
import type { Executor } from "./sync-db";

/**
 * The phone's `reflight` ruling events just pushed (lib/events/schema.ts; scoring keeps them as rulings,
 * lib/results/sources.ts) on a lane of a contest duty's run become re-flight requests for the officer:
 * only a lane linked to a slot or a re-flight grant whose timekeeper is the pushing account. Asked at the
 * phone's corrected time; one request per event (a push sent again adds nothing). Called by the push (sync-push.ts).
 */
export async function recordReflightRequests(tx: Executor, userId: string, events: readonly RunEvent[]): Promise<number> {
  const rulings = events.flatMap((e) => (e.body.kind === "reflight" ? [{ e, body: e.body }] : []));
  if (rulings.length === 0) return 0;
  const col = <T>(pick: (r: (typeof rulings)[number]) => T) => sql.param(rulings.map(pick));
  // one statement for the push's rulings, whatever their number: each finds its slot or grant (the first of the two) by a lateral lookup
  const res = await tx.execute(sql`
    insert into contest_reflight_requests (round_id, entry_id, event_id, run_id, lane, cause, placement, reason, asked_by, asked_at)
    select x.round_id, x.entry_id, u.id, u.run_id, u.lane, u.cause, u.placement, u.reason, ${userId}::uuid, u.at
    from unnest(${col((r) => r.e.id)}::uuid[], ${col((r) => r.e.runId)}::uuid[], ${col((r) => r.body.lane)}::smallint[], ${col((r) => r.body.cause)}::text[],
      ${col((r) => r.body.placement)}::text[], ${col((r) => r.body.reason ?? null)}::text[],
      ${col((r) => new Date(r.e.stamp.wallMs + (r.e.stamp.offset?.thetaMs ?? 0)).toISOString())}::timestamptz[])
      as u(id, run_id, lane, cause, placement, reason, at)
    cross join lateral (
      select g.round_id, g.entry_id from group_slots g where g.run_id = u.run_id and g.lane = u.lane and g.timekeeper_user_id = ${userId}::uuid
      union
      select r.round_id, r.entry_id from contest_reflights r where r.run_id = u.run_id and r.lane = u.lane and r.timekeeper_user_id = ${userId}::uuid
      limit 1
    ) x
    on conflict (event_id) do nothing`);
  return res.rowCount ?? 0;
}

/**
 * An undo on the phone (a `void` naming a `reflight` ruling) withdraws that ruling's request while it is still
 * open, recorded with who undid it (the timekeeper who asked) and when (the phone's corrected time). A request the
 * officer already decided stays as decided: the grant or dismissal is theirs. Called by the push after
 * recordReflightRequests, so a ruling undone in the same push is withdrawn at once.
 */
export async function withdrawReflightRequests(tx: Executor, userId: string, voids: readonly RunEvent[]): Promise<number> {
  const undone = voids.flatMap((e) => (e.body.kind === "void" ? [{ target: e.body.targetId, at: new Date(e.stamp.wallMs + (e.stamp.offset?.thetaMs ?? 0)).toISOString() }] : []));
  if (undone.length === 0) return 0;
  // one statement for the push's undos, whatever their number (most name a flight, not a ruling: they match nothing)
  const res = await tx.execute(sql`
    update contest_reflight_requests q set status = 'withdrawn', decided_by = ${userId}::uuid, decided_at = u.at
    from unnest(${sql.param(undone.map((u) => u.target))}::uuid[], ${sql.param(undone.map((u) => u.at))}::timestamptz[]) as u(target, at)
    where q.event_id = u.target and q.asked_by = ${userId}::uuid and q.status = 'open'`);
  return res.rowCount ?? 0;
}

/**
 * When an officer links a run's lane to a pilot's slot by hand (contest-results.ts linkRun), the `reflight` rulings
 * already stored on that lane become requests too (a ruling pushed before the link found no slot then): asked by
 * whoever recorded the ruling, at its corrected time. A ruling undone on the phone (a `void` naming it) is left
 * out; one request per event, as on the push.
 */
export async function requestsFromLinkedLane(tx: Executor, p: { roundId: string; entryId: string; runId: string; lane: number }): Promise<number> {
  const res = await tx.execute(sql`
    insert into contest_reflight_requests (round_id, entry_id, event_id, run_id, lane, cause, placement, reason, asked_by, asked_at)
    select ${p.roundId}::uuid, ${p.entryId}::uuid, e.id, e.run_id, ${p.lane}::smallint, e.body ->> 'cause', e.body ->> 'placement', e.body ->> 'reason',
      e.recorded_by, to_timestamp(e.corrected_ms / 1000.0)
    from events e
    where e.run_id = ${p.runId}::uuid and e.kind = 'reflight' and (e.body ->> 'lane')::int = ${p.lane}
      and not exists (select 1 from events v where v.run_id = e.run_id and v.kind = 'void' and v.body ->> 'targetId' = e.id::text)
    on conflict (event_id) do nothing`);
  return res.rowCount ?? 0;
}

const asker = alias(users, "request_asker");
const decider = alias(users, "request_decider");

/** The round's re-flight requests from the phones, open first, with the pilot, who asked and when, and who decided. */
export async function listRoundReflightRequests(db: Database, roundId: string) {
  return db.select({
    id: contestReflightRequests.id, entryId: contestReflightRequests.entryId, name: contestEntries.pilotName, cause: contestReflightRequests.cause,
    placement: contestReflightRequests.placement, reason: contestReflightRequests.reason, askedBy: asker.name, askedAt: contestReflightRequests.askedAt,
    status: contestReflightRequests.status, decidedBy: decider.name, decidedAt: contestReflightRequests.decidedAt,
  }).from(contestReflightRequests)
    .innerJoin(contestEntries, eq(contestEntries.id, contestReflightRequests.entryId))
    .leftJoin(asker, eq(asker.id, contestReflightRequests.askedBy))
    .leftJoin(decider, eq(decider.id, contestReflightRequests.decidedBy))
    .where(eq(contestReflightRequests.roundId, roundId))
    .orderBy(sql`${contestReflightRequests.status} <> 'open'`, asc(contestReflightRequests.askedAt));
}

export type RequestDecision =
  | { decision: "dismiss" }
  | { decision: "grant"; placement: "later-group" | "new-group" | "original-group"; groupNumber: number; entitled: boolean; reason: string | null };

/**
 * The officer's decision on a request (F3K.9.6: granting a re-flight is the contest director's): "grant"
 * makes the re-flight grant (grantReflight's rules, the request's cause; its answer is returned when it
 * refuses) and links it to the request; "dismiss" grants nothing. Either way who and when are kept. One
 * decision per request ("decided_already"); "no_request" when it is not this round's.
 */
export async function decideReflightRequest(db: Database, p: { roundId: string; requestId: string; userId: string } & RequestDecision):
  Promise<"granted" | "dismissed" | "no_request" | "decided_already" | "no_slot" | "bad_group" | "granted_already"> {
  return db.transaction(async (tx) => {
    const [req] = await tx.select().from(contestReflightRequests)
      .where(and(eq(contestReflightRequests.id, p.requestId), eq(contestReflightRequests.roundId, p.roundId))).for("update");
    if (!req) return "no_request";
    if (req.status !== "open") return "decided_already";
    const now = new Date();
    if (p.decision === "dismiss") {
      await tx.update(contestReflightRequests).set({ status: "dismissed", decidedBy: p.userId, decidedAt: now }).where(eq(contestReflightRequests.id, req.id));
      return "dismissed";
    }
    const granted = await grantReflight(tx as unknown as Database, {
      roundId: p.roundId, entryId: req.entryId, userId: p.userId, cause: req.cause, placement: p.placement, entitled: p.entitled, groupNumber: p.groupNumber,
      reason: p.reason ?? req.reason,
    });
    if (granted !== "granted") return granted;
    const [grant] = await tx.execute<{ id: string }>(sql`select id::text from contest_reflights where round_id = ${p.roundId} and entry_id = ${req.entryId}`).then((r) => r.rows);
    await tx.update(contestReflightRequests).set({ status: "granted", decidedBy: p.userId, decidedAt: now, reflightId: grant?.id ?? null }).where(eq(contestReflightRequests.id, req.id));
    return "granted";
  });
}
