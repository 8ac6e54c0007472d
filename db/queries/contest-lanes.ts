import "server-only";
import { sql } from "drizzle-orm";
import type { LinkableLane } from "@/lib/contests/linkable";
import type { Database } from "../index";

/**
 * Lanes of runs timed at the club's sessions around the contest day (the day before to the day
 * after, in UTC: a local day spans two UTC dates) with this task letter: what an officer can link
 * to a pilot's slot. Newest first, at most 200.
 */
export async function listLinkableLanes(db: Database, p: { clubId: string; day: string; letter: string | null }): Promise<LinkableLane[]> {
  const res = await db.execute<{ run_id: string; lane: number; pilot_name: string; result_tenths: number | null; started_at: string; letter: string | null }>(sql`
    select l.run_id, l.lane, l.pilot_name, l.result_tenths, r.created_at::text as started_at, r.task ->> 'letter' as letter
    from run_lanes l join runs r on r.id = l.run_id join field_sessions s on s.id = r.session_id
    where s.club_id = ${p.clubId}
      and r.created_at >= (${p.day}::date - 1)::timestamptz and r.created_at < (${p.day}::date + 2)::timestamptz
      and r.task ->> 'letter' is not distinct from ${p.letter}
    order by r.created_at desc, l.lane limit 200`);
  return res.rows.map((r) => ({ runId: r.run_id, lane: r.lane, pilotName: r.pilot_name, resultTenths: r.result_tenths, startedAt: r.started_at, taskLetter: r.letter }));
}
