import "server-only";
import { and, asc, count, eq, sql } from "drizzle-orm";
import { clubSlug } from "@/lib/clubs/slug";
import type { ClubRole } from "@/lib/clubs/roles";
import type { Database } from "../index";
import { clubs, memberships, users } from "../schema";

export type ClubSummary = { id: string; name: string; slug: string; homeField: string | null };

/**
 * Creates a club with its creator as its first officer, under the first free address name made
 * from its name ("kestrel-downs", then "kestrel-downs-2", …).
 */
export async function createClub(db: Database, input: { name: string; userId: string }): Promise<ClubSummary> {
  return db.transaction(async (tx) => {
    for (let n = 1; ; n++) {
      const [club] = await tx
        .insert(clubs)
        .values({ name: input.name, slug: clubSlug(input.name, n) })
        .onConflictDoNothing({ target: clubs.slug })
        .returning({ id: clubs.id, name: clubs.name, slug: clubs.slug, homeField: clubs.homeField });
      if (!club) continue;
      await tx.insert(memberships).values({ clubId: club.id, userId: input.userId, role: "officer" });
      return club;
    }
  });
}

/** The club with this address name and the user's role in it (null: not a member); undefined when no such club. */
export async function getClubAccess(db: Database, params: { slug: string; userId: string }) {
  const [row] = await db
    .select({ club: { id: clubs.id, name: clubs.name, slug: clubs.slug, homeField: clubs.homeField }, role: memberships.role })
    .from(clubs)
    .leftJoin(memberships, and(eq(memberships.clubId, clubs.id), eq(memberships.userId, params.userId)))
    .where(eq(clubs.slug, params.slug))
    .limit(1);
  return row;
}

/** The user's clubs with their role and the number of members, by name. */
export async function listMyClubs(db: Database, userId: string): Promise<(ClubSummary & { role: ClubRole; members: number })[]> {
  const res = await db.execute<{ id: string; name: string; slug: string; home_field: string | null; role: ClubRole; members: number }>(sql`
    select c.id, c.name, c.slug, c.home_field, m.role,
      (select count(*)::int from memberships all_m where all_m.club_id = c.id) as members
    from memberships m join clubs c on c.id = m.club_id
    where m.user_id = ${userId}
    order by c.name, c.slug`);
  return res.rows.map((r) => ({ id: r.id, name: r.name, slug: r.slug, homeField: r.home_field, role: r.role, members: r.members }));
}

export type ClubMember = { userId: string; name: string; email: string; role: ClubRole; since: Date };

/** The club's members, officers first, then coaches, then members, each by name. */
export async function listClubMembers(db: Database, clubId: string): Promise<ClubMember[]> {
  return db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role, since: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.clubId, clubId))
    .orderBy(sql`case ${memberships.role} when 'officer' then 0 when 'coach' then 1 else 2 end`, asc(users.name), asc(users.id));
}

/** How many members the club has (for tests and the admin). */
export async function countMembers(db: Database, clubId: string): Promise<number> {
  const [row] = await db.select({ n: count() }).from(memberships).where(eq(memberships.clubId, clubId));
  return row?.n ?? 0;
}

/** The club with this id, or undefined. */
export async function getClubById(db: Database, id: string): Promise<ClubSummary | undefined> {
  const [row] = await db.select({ id: clubs.id, name: clubs.name, slug: clubs.slug, homeField: clubs.homeField }).from(clubs).where(eq(clubs.id, id)).limit(1);
  return row;
}

/** The club's time zone (an IANA name; "UTC" until an officer sets one). */
export async function getClubTimeZone(db: Database, clubId: string): Promise<string> {
  const [row] = await db.select({ timeZone: clubs.timeZone }).from(clubs).where(eq(clubs.id, clubId)).limit(1);
  return row?.timeZone ?? "UTC";
}

/** Sets the club's time zone (validated by the caller with Intl): its days are dates on that clock from now on. */
export async function setClubTimeZone(db: Database, params: { clubId: string; timeZone: string }): Promise<void> {
  await db.update(clubs).set({ timeZone: params.timeZone }).where(eq(clubs.id, params.clubId));
}
