import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import type { Database } from "../index";
import { clubDays, clubFields } from "../schema";

export type ClubDayRow = { id: string; fieldId: string; fieldName: string; day: string; openedBy: string | null; createdAt: Date };

/**
 * Opens a day at one of the club's fields (the club in the WHERE: another club's field opens nothing).
 * Opening a day that is open already returns it. Null when the field is not the club's.
 */
export async function openClubDay(
  db: Database,
  params: { clubId: string; fieldId: string; day: string; userId: string },
): Promise<{ day: ClubDayRow; created: boolean } | null> {
  const inserted = await db.execute<{ id: string }>(sql`
    insert into club_days (club_id, field_id, day, opened_by)
    select f.club_id, f.id, ${params.day}::date, ${params.userId}
    from club_fields f where f.id = ${params.fieldId} and f.club_id = ${params.clubId}
    on conflict (club_id, field_id, day) do nothing
    returning id`);
  const [row] = await listClubDays(db, { clubId: params.clubId, day: params.day, fieldId: params.fieldId });
  if (!row) return null;
  return { day: row, created: inserted.rows.length > 0 };
}

/** The club's open days on one date (each at one field), by field name. */
export async function listClubDays(
  db: Database,
  params: { clubId: string; day: string; fieldId?: string },
): Promise<ClubDayRow[]> {
  return db
    .select({
      id: clubDays.id, fieldId: clubDays.fieldId, fieldName: clubFields.name, day: clubDays.day,
      openedBy: clubDays.openedBy, createdAt: clubDays.createdAt,
    })
    .from(clubDays)
    .innerJoin(clubFields, eq(clubFields.id, clubDays.fieldId))
    .where(
      and(
        eq(clubDays.clubId, params.clubId),
        eq(clubDays.day, params.day),
        params.fieldId === undefined ? undefined : eq(clubDays.fieldId, params.fieldId),
      ),
    )
    .orderBy(asc(clubFields.name), asc(clubDays.id));
}
