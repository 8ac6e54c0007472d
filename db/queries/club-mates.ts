import "server-only";
import { sql } from "drizzle-orm";
import type { Database } from "../index";

export type ClubMate = { id: string; name: string };

/**
 * Everyone who shares a club with the user (the user included), by name: the pilots a
 * timekeeper may name as a lane's pilot (lib/sync/authorise.ts pilotRefusal).
 */
export async function listClubMates(db: Database, userId: string): Promise<ClubMate[]> {
  const res = await db.execute<ClubMate>(sql`
    select distinct u.id::text as id, u.name
    from memberships mine
    join memberships theirs on theirs.club_id = mine.club_id
    join users u on u.id = theirs.user_id
    where mine.user_id = ${userId}
    order by u.name, id`);
  return res.rows;
}
