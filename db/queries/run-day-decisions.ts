import "server-only";
import { sql } from "drizzle-orm";
import type { Database } from "../index";
import { getDayBoard } from "./club-day-board";
import { runIsUsers } from "./run-own";

/** A club day's decision that counts another record for a lane of a run than the run's own result does. */
export type RunDayDecision = {
  clubName: string;
  /** The club's address, for the link to its Day board: members only (null for a pilot who is not one). */
  clubSlug: string | null;
  day: string;
  timeZone: string;
  lane: number;
  /** The phone whose record the board counts, and its owner's name (a member's). */
  deviceId: string;
  recordedByName: string | null;
  /** The lane's result on the Day board (runResult with that record standing) and the run's own (run_lanes). */
  boardResultTenths: number | null;
  runResultTenths: number | null;
  decidedByName: string | null;
  decidedAt: string;
  note: string;
};

type Row = {
  club_id: string; club_name: string; slug: string; time_zone: string; day: string; lane: number; device_id: string; note: string;
  decided_at: Date | string; decided_by_name: string | null; member: boolean; result_tenths: number | null; source_device: string | null;
};

/**
 * The decisions of club days on this run's lanes that count another record than the run's own result
 * uses (club_day_decisions naming a phone; the stored result's record is another), for `userId`:
 * - the lane's pilot always sees a decision on their lane (their result, whoever they are now);
 * - a member of the deciding club sees it when the run is theirs to see: they set it up or fly in it
 *   (a lane they did not dispute or hide) — what its Day board shows them anyway;
 * - nobody else learns of it (another club's members, coaches, a recorder outside the club).
 * Each is read from the day's board (getDayBoard): a lane that is no longer on it, or whose record
 * is the run's own, gives nothing.
 */
export async function listRunDayDecisions(db: Database, params: { userId: string; runId: string }): Promise<RunDayDecision[]> {
  const res = await db.execute<Row>(sql`
    select x.club_id, c.name as club_name, c.slug, c.time_zone, x.day::text as day, x.lane, x.device_id, x.note, x.decided_at,
      u.name as decided_by_name, (m.user_id is not null) as member, l.result_tenths, l.derived #>> '{source,deviceId}' as source_device
    from club_day_decisions x
    join clubs c on c.id = x.club_id
    join runs r on r.id = x.run_id
    join run_lanes l on l.run_id = x.run_id and l.lane = x.lane
    left join memberships m on m.club_id = x.club_id and m.user_id = ${params.userId}
    left join users u on u.id = x.decided_by
    where x.run_id = ${params.runId} and x.device_id is not null
      and (l.pilot_user_id = ${params.userId}
        or (m.user_id is not null and ${runIsUsers(sql`r`, params.userId)}))
    order by x.day, c.name, x.lane`);
  const out: RunDayDecision[] = [];
  const boards = new Map<string, Awaited<ReturnType<typeof getDayBoard>>>();
  for (const r of res.rows) {
    if (r.device_id === r.source_device) continue; // the record the rules use already: nothing otherwise
    const key = `${r.club_id}:${r.day}`;
    if (!boards.has(key)) boards.set(key, await getDayBoard(db, { clubId: r.club_id, day: r.day }));
    const board = boards.get(key);
    const lane = board?.runs.find((x) => x.runId === params.runId)?.lanes.find((l) => l.lane === r.lane);
    if (!board || !lane?.decided) continue;
    const version = board.disagreements.find((d) => d.runId === params.runId && d.lane === r.lane)?.versions.find((v) => v.deviceId === r.device_id);
    out.push({
      clubName: r.club_name, clubSlug: r.member ? r.slug : null, day: r.day, timeZone: r.time_zone, lane: r.lane,
      deviceId: r.device_id, recordedByName: version ? (board.people[version.recordedBy] ?? null) : null,
      boardResultTenths: lane.resultTenths, runResultTenths: r.result_tenths,
      decidedByName: r.decided_by_name, decidedAt: new Date(r.decided_at).toISOString(), note: r.note,
    });
  }
  return out;
}
