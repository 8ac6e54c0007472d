import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import type { ClubField } from "@/lib/validations/clubs";
import type { Database } from "../index";
import { clubFields } from "../schema";

export type ClubFieldRow = ClubField & { id: string };

const columns = {
  id: clubFields.id, name: clubFields.name, latitude: clubFields.latitude, longitude: clubFields.longitude,
  launchDirection: clubFields.launchDirection, safetyAreas: clubFields.safetyAreas, localRules: clubFields.localRules,
};

/** Adds a field to the club; "taken" when the club already has a field of that name (nothing changes). */
export async function addClubField(db: Database, clubId: string, field: ClubField): Promise<ClubFieldRow | "taken"> {
  const [row] = await db.insert(clubFields).values({ clubId, ...field }).onConflictDoNothing().returning(columns);
  return row ?? "taken";
}

/** Removes one of the club's fields (the club in the WHERE: another club's field id removes nothing). */
export async function removeClubField(db: Database, params: { clubId: string; fieldId: string }): Promise<boolean> {
  const rows = await db.delete(clubFields).where(and(eq(clubFields.clubId, params.clubId), eq(clubFields.id, params.fieldId))).returning({ id: clubFields.id });
  return rows.length > 0;
}

/** The club's fields by name. */
export async function listClubFields(db: Database, clubId: string): Promise<ClubFieldRow[]> {
  return db.select(columns).from(clubFields).where(eq(clubFields.clubId, clubId)).orderBy(asc(clubFields.name));
}

export type MyClubField = ClubFieldRow & { clubName: string };

/** The fields of every club the user belongs to, for the Field screen's set-up form (kept on the phone). */
export async function listMyClubFields(db: Database, userId: string): Promise<MyClubField[]> {
  const res = await db.execute<{
    id: string; name: string; latitude: number | null; longitude: number | null;
    launch_direction: string | null; safety_areas: string | null; local_rules: string | null; club_name: string;
  }>(sql`
    select f.id, f.name, f.latitude, f.longitude, f.launch_direction, f.safety_areas, f.local_rules, c.name as club_name
    from memberships m join clubs c on c.id = m.club_id join club_fields f on f.club_id = c.id
    where m.user_id = ${userId}
    order by f.name, c.name, f.id
    limit 500`);
  return res.rows.map((r) => ({
    id: r.id, name: r.name, latitude: r.latitude, longitude: r.longitude, launchDirection: r.launch_direction,
    safetyAreas: r.safety_areas, localRules: r.local_rules, clubName: r.club_name,
  }));
}
