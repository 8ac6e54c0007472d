import "server-only";
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import type { PenaltyCause } from "@/lib/events/schema";
import type { ContestPenalty, OfficerPenalty } from "@/lib/contests/penalties";

export type { ContestPenalty };
import type { Database } from "../index";
import { contestPenalties, groupSlots, runLanes } from "../schema";


/**
 * Every penalty of the contest's slots with its cause, size, who and when: the officers' one by one
 * (contest_penalties, removed ones too, marked), the phone's from the linked lane's derived penalties
 * (`run_lanes.derived.penalties`, lib/results runResult, only while the run is the slot's record — no
 * paper card with flights), the re-flight's run's likewise, and the paper card's penalty points with the
 * card's `recorded_by`/`recorded_at`; a phone's penalty an officer set aside is listed from the officer's event
 * (not counting, with who, when and why as its removal). The round page, the results page, the penalties CSV and the PDF list them.
 */
export async function listContestPenalties(db: Database, contestId: string, roundId?: string): Promise<ContestPenalty[]> {
  const inRound = roundId ? sql`and r.id = ${roundId}` : sql``;
  const lanePenalties = (table: "group_slots" | "contest_reflights", source: "phone" | "reflight-phone") => sql`
    select null::uuid as id, r.number as "roundNumber", r.is_fly_off as "isFlyOff", e.id as "entryId", e.pilot_name as name, ${source}::text as source,
      (p ->> 'points')::int as points, p ->> 'cause' as cause, p ->> 'reason' as reason,
      coalesce((p ->> 'applied')::boolean, true) as applied, p ->> 'dropped' as dropped, u.name as "givenBy", ev.corrected_ms::float8 as "givenAtMs",
      null::text as "removedBy", null::float8 as "removedAtMs", null::text as "removedReason", ev.id as "eventId"
    from ${sql.identifier(table)} g
    join contest_rounds r on r.id = g.round_id
    join contest_entries e on e.id = g.entry_id
    join run_lanes l on l.run_id = g.run_id and l.lane = g.lane
    cross join lateral jsonb_array_elements(case when jsonb_typeof(l.derived -> 'penalties') = 'array' then l.derived -> 'penalties' else '[]'::jsonb end) p
    left join events ev on ev.id::text = p ->> 'eventId'
    left join users u on u.id = ev.recorded_by
    where r.contest_id = ${contestId} and g.paper_flights is null ${inRound}`;
  // the phone's penalties an officer set aside (db/queries/contest-phone-set-aside.ts): no longer in the
  // lane's derived list, listed from the officer's event with who, when (the server's clock) and why
  const setAside = (table: "group_slots" | "contest_reflights", source: "phone" | "reflight-phone") => sql`
    select null::uuid, r.number, r.is_fly_off, e.id, e.pilot_name, ${source}::text,
      (pe.body ->> 'points')::int, pe.body ->> 'cause', pe.body ->> 'reason', false, null, pu.name, pe.corrected_ms::float8,
      su.name, sa.corrected_ms::float8, sa.body -> 'setAside' ->> 'reason', pe.id
    from ${sql.identifier(table)} g
    join contest_rounds r on r.id = g.round_id
    join contest_entries e on e.id = g.entry_id
    join events sa on sa.run_id = g.run_id and sa.kind = 'void' and sa.device_id like 'officer:%' and sa.body ? 'setAside'
    join events pe on pe.id::text = sa.body ->> 'targetId' and pe.kind = 'penalty' and (pe.body ->> 'lane')::int = g.lane
    left join users pu on pu.id = pe.recorded_by
    left join users su on su.id = sa.recorded_by
    where r.contest_id = ${contestId} and g.paper_flights is null ${inRound}`;
  const rows = await db.execute<ContestPenalty>(sql`
    ${lanePenalties("group_slots", "phone")}
    union all ${lanePenalties("contest_reflights", "reflight-phone")}
    union all ${setAside("group_slots", "phone")}
    union all ${setAside("contest_reflights", "reflight-phone")}
    union all
    select null::uuid, r.number, r.is_fly_off, e.id, e.pilot_name, 'card', g.penalty_points, null, null, true, null, u.name, extract(epoch from g.recorded_at)::float8 * 1000,
      null, null, null, null
    from group_slots g
    join contest_rounds r on r.id = g.round_id
    join contest_entries e on e.id = g.entry_id
    left join users u on u.id = g.recorded_by
    where r.contest_id = ${contestId} and g.penalty_points > 0 ${inRound}
    union all
    select cp.id, r.number, r.is_fly_off, e.id, e.pilot_name, 'officer', cp.points, cp.cause, cp.note, cp.removed_at is null, null, gu.name, extract(epoch from cp.given_at)::float8 * 1000,
      ru.name, extract(epoch from cp.removed_at)::float8 * 1000, cp.removed_reason, null
    from contest_penalties cp
    join contest_rounds r on r.id = cp.round_id
    join contest_entries e on e.id = cp.entry_id
    left join users gu on gu.id = cp.given_by
    left join users ru on ru.id = cp.removed_by
    where r.contest_id = ${contestId} ${inRound}
    order by 3, 2, 5, 13`);
  return rows.rows.map((r) => ({
    ...r, points: Number(r.points), givenAtMs: r.givenAtMs === null ? null : Number(r.givenAtMs), removedAtMs: r.removedAtMs === null ? null : Number(r.removedAtMs),
  }));
}

/** The officers' penalties that count (not removed) per slot ("roundId/entryId"), for the standings. */
export async function officerPenaltiesOfRounds(db: Database, roundIds: readonly string[]): Promise<Map<string, OfficerPenalty[]>> {
  const out = new Map<string, OfficerPenalty[]>();
  if (roundIds.length === 0) return out;
  const rows = await db.select({ id: contestPenalties.id, roundId: contestPenalties.roundId, entryId: contestPenalties.entryId, points: contestPenalties.points, cause: contestPenalties.cause })
    .from(contestPenalties).where(and(inArray(contestPenalties.roundId, [...roundIds]), isNull(contestPenalties.removedAt))).orderBy(contestPenalties.givenAt, contestPenalties.id);
  for (const r of rows) {
    const key = `${r.roundId}/${r.entryId}`;
    out.set(key, [...(out.get(key) ?? []), { id: r.id, points: r.points, cause: r.cause }]);
  }
  return out;
}

/**
 * An officer gives a pilot drawn in the round a penalty (who and when kept). "no_slot": the pilot is
 * not drawn in the round. "phone_has_it": the pilot's counting record is a timed run whose lane already
 * has a counting penalty of this cause from the timekeeper's phone — the same penalty typed again would
 * count twice — unless `separate` says it is another one (a later attempt).
 */
export async function givePenalty(db: Database, p: {
  roundId: string; entryId: string; userId: string; cause: PenaltyCause; points: number; note: string | null; separate: boolean;
}): Promise<{ id: string } | "no_slot" | "phone_has_it"> {
  const [slot] = await db.select({ paperFlights: groupSlots.paperFlights, derived: runLanes.derived }).from(groupSlots)
    .leftJoin(runLanes, and(eq(runLanes.runId, groupSlots.runId), eq(runLanes.lane, groupSlots.lane)))
    .where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.entryId, p.entryId)));
  if (!slot) return "no_slot";
  if (!p.separate && slot.paperFlights === null) {
    const phone = (slot.derived as { penalties?: { cause?: string | null; applied?: boolean }[] } | null)?.penalties ?? [];
    if (phone.some((x) => x.cause === p.cause && x.applied !== false)) return "phone_has_it";
  }
  const [row] = await db.insert(contestPenalties).values({ roundId: p.roundId, entryId: p.entryId, cause: p.cause, points: p.points, note: p.note, givenBy: p.userId })
    .returning({ id: contestPenalties.id });
  return { id: row!.id };
}

/**
 * An officer removes an officer's penalty of the round: it stays, marked with who removed it, when and
 * why, and no longer counts. "not_found" for a penalty not in this round; "removed_already" (the first
 * removal stands).
 */
export async function removePenalty(db: Database, p: { roundId: string; penaltyId: string; userId: string; reason: string }): Promise<"removed" | "not_found" | "removed_already"> {
  return db.transaction(async (tx) => {
    const [row] = await tx.select({ removedAt: contestPenalties.removedAt }).from(contestPenalties)
      .where(and(eq(contestPenalties.id, p.penaltyId), eq(contestPenalties.roundId, p.roundId))).for("update");
    if (!row) return "not_found";
    if (row.removedAt !== null) return "removed_already";
    await tx.update(contestPenalties).set({ removedBy: p.userId, removedAt: new Date(), removedReason: p.reason }).where(eq(contestPenalties.id, p.penaltyId));
    return "removed";
  });
}
