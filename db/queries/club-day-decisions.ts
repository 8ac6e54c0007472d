import "server-only";
import { sql } from "drizzle-orm";
import type { DayDecision } from "@/lib/days/board";
import type { Database } from "../index";

/** A stored decision, and whether this call changed which record stands (the mail of a late decision goes on that). */
export type RecordedDecision = { decision: DayDecision; recordChanged: boolean; before: { deviceId: string | null } | null };

/**
 * Records an officer's decision on a lane of a club's day (a new one replaces the old, with its
 * author and time). The caller checks first that the lane is one the day's board lists as recorded
 * differently and that the device is one of its versions. The same decision again (same record, same
 * note) changes nothing, not even its time, and reports no change: the row is updated only when it
 * differs (ON CONFLICT … WHERE), after the earlier row is read FOR UPDATE in the same transaction, so
 * two equal PUTs at once report one change. `recordChanged`: the record that stands is another than
 * before (no decision before counts as none chosen by hand).
 */
export async function recordDayDecision(
  db: Database,
  params: { clubId: string; day: string; runId: string; lane: number; deviceId: string | null; note: string; userId: string },
): Promise<RecordedDecision> {
  return db.transaction(async (tx) => {
    const key = sql`club_id = ${params.clubId} and day = ${params.day}::date and run_id = ${params.runId} and lane = ${params.lane}`;
    const old = await tx.execute<Row>(sql`select device_id, note, decided_by, decided_at from club_day_decisions where ${key} for update`);
    const res = await tx.execute<Row>(sql`
      insert into club_day_decisions (club_id, day, run_id, lane, device_id, note, decided_by)
      values (${params.clubId}, ${params.day}::date, ${params.runId}, ${params.lane}, ${params.deviceId}, ${params.note}, ${params.userId})
      on conflict (club_id, day, run_id, lane) do update
        set device_id = excluded.device_id, note = excluded.note, decided_by = excluded.decided_by, decided_at = now()
        where club_day_decisions.device_id is distinct from excluded.device_id or club_day_decisions.note <> excluded.note
      returning device_id, note, decided_by, decided_at`);
    const r = res.rows[0];
    if (!r) {
      // the same decision as stored (perhaps by an equal PUT that committed while this one waited): nothing changed
      const same = old.rows[0] ?? (await tx.execute<Row>(sql`select device_id, note, decided_by, decided_at from club_day_decisions where ${key}`)).rows[0]!;
      return { decision: toDecision(same), recordChanged: false, before: { deviceId: same.device_id } };
    }
    const before = old.rows[0] ? { deviceId: old.rows[0].device_id } : null;
    return { decision: toDecision(r), recordChanged: (before?.deviceId ?? null) !== r.device_id, before };
  });
}

type Row = { device_id: string | null; note: string; decided_by: string | null; decided_at: Date | string };

const toDecision = (r: Row): DayDecision => ({
  deviceId: r.device_id, note: r.note, decidedBy: r.decided_by, decidedAt: new Date(r.decided_at).toISOString(),
});
