import "server-only";
import { sql } from "drizzle-orm";
import type { DayDecision } from "@/lib/days/board";
import type { Database } from "../index";

/**
 * Records an officer's decision on a lane of a club's day (a new one replaces the old, with its
 * author and time). The caller checks first that the lane is one the day's board lists as recorded
 * differently and that the device is one of its versions.
 */
export async function recordDayDecision(
  db: Database,
  params: { clubId: string; day: string; runId: string; lane: number; deviceId: string | null; note: string; userId: string },
): Promise<DayDecision> {
  const res = await db.execute<{ device_id: string | null; note: string; decided_by: string | null; decided_at: Date | string }>(sql`
    insert into club_day_decisions (club_id, day, run_id, lane, device_id, note, decided_by)
    values (${params.clubId}, ${params.day}::date, ${params.runId}, ${params.lane}, ${params.deviceId}, ${params.note}, ${params.userId})
    on conflict (club_id, day, run_id, lane) do update
      set device_id = excluded.device_id, note = excluded.note, decided_by = excluded.decided_by, decided_at = now()
    returning device_id, note, decided_by, decided_at`);
  const r = res.rows[0]!;
  return { deviceId: r.device_id, note: r.note, decidedBy: r.decided_by, decidedAt: new Date(r.decided_at).toISOString() };
}
