import "server-only";
import { sql } from "drizzle-orm";
import type { PenaltyCause } from "@/lib/events/schema";
import type { Database } from "../index";

export type ContestPenalty = {
  roundNumber: number; isFlyOff: boolean; name: string;
  /** "phone": a `penalty` event of the linked run's lane (or the re-flight's run), as runResult derived it; "card": the paper card's points. */
  source: "phone" | "reflight-phone" | "card";
  points: number; cause: PenaltyCause | null; reason: string | null;
  /** Whether it counts (F3K.4.3: only the highest of one attempt, none for a mid-air collision); a card's always does. */
  applied: boolean; dropped: "mid-air-collision" | "higher-in-same-attempt" | null;
  /** Who gave it (the phone's account) or entered the card, and when (the event's corrected time, the card's recorded time). */
  givenBy: string | null; givenAtMs: number | null;
};

/**
 * Every penalty of the contest's slots with its cause, size, who and when: the phone's from the linked
 * lane's derived penalties (`run_lanes.derived.penalties`, lib/results runResult, only while the run is
 * the slot's record — no paper card with flights), the re-flight's run's likewise, and the paper card's
 * penalty points with the card's `recorded_by`/`recorded_at`. The results page lists them.
 */
export async function listContestPenalties(db: Database, contestId: string): Promise<ContestPenalty[]> {
  const lanePenalties = (table: "group_slots" | "contest_reflights", source: "phone" | "reflight-phone") => sql`
    select r.number as "roundNumber", r.is_fly_off as "isFlyOff", e.pilot_name as name, ${source}::text as source,
      (p ->> 'points')::int as points, p ->> 'cause' as cause, p ->> 'reason' as reason,
      coalesce((p ->> 'applied')::boolean, true) as applied, p ->> 'dropped' as dropped, u.name as "givenBy", ev.corrected_ms as "givenAtMs"
    from ${sql.identifier(table)} g
    join contest_rounds r on r.id = g.round_id
    join contest_entries e on e.id = g.entry_id
    join run_lanes l on l.run_id = g.run_id and l.lane = g.lane
    cross join lateral jsonb_array_elements(case when jsonb_typeof(l.derived -> 'penalties') = 'array' then l.derived -> 'penalties' else '[]'::jsonb end) p
    left join events ev on ev.id::text = p ->> 'eventId'
    left join users u on u.id = ev.recorded_by
    where r.contest_id = ${contestId} and g.paper_flights is null`;
  const rows = await db.execute<ContestPenalty>(sql`
    ${lanePenalties("group_slots", "phone")}
    union all ${lanePenalties("contest_reflights", "reflight-phone")}
    union all
    select r.number, r.is_fly_off, e.pilot_name, 'card', g.penalty_points, null, null, true, null, u.name, extract(epoch from g.recorded_at) * 1000
    from group_slots g
    join contest_rounds r on r.id = g.round_id
    join contest_entries e on e.id = g.entry_id
    left join users u on u.id = g.recorded_by
    where r.contest_id = ${contestId} and g.penalty_points > 0
    order by 2, 1, 3, 11`);
  return rows.rows.map((r) => ({ ...r, points: Number(r.points), givenAtMs: r.givenAtMs === null ? null : Number(r.givenAtMs) }));
}
