import "server-only";
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import type { CreateContestInput } from "@/lib/validations/contests";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import type { TaskDefinition } from "@/lib/tasks/definition";
import type { Database } from "../index";
import { clubs, contestEntries, contestRounds, contests, groupSlots, models } from "../schema";

export type ContestRow = typeof contests.$inferSelect;
export type EntryRow = typeof contestEntries.$inferSelect;

/** Creates a contest with its rounds (each round's whole catalogue task stored, tagged with its edition). */
export async function createContest(db: Database, p: { clubId: string; userId: string; input: CreateContestInput }): Promise<ContestRow> {
  const { rounds, flyOffRounds, entriesCloseAt, ...rest } = p.input;
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(contests).values({ ...rest, entriesCloseAt: entriesCloseAt === null ? null : new Date(entriesCloseAt), clubId: p.clubId, createdBy: p.userId, status: "open" }).returning();
    await tx.insert(contestRounds).values([
      ...rounds.map((r, i) => ({ contestId: row!.id, number: i + 1, task: getCatalogueTask(r.letter) })),
      ...flyOffRounds.map((r, i) => ({ contestId: row!.id, number: i + 1, isFlyOff: true, task: getCatalogueTask(r.letter) })),
    ]);
    return row!;
  });
}

/** The time zone of the contest's club (IANA name; "UTC" unless an officer set one): times on contest pages are shown in it. */
export async function contestTimeZone(db: Database, contestId: string): Promise<string> {
  const [row] = await db.select({ zone: clubs.timeZone }).from(contests).innerJoin(clubs, eq(clubs.id, contests.clubId)).where(eq(contests.id, contestId));
  return row?.zone ?? "UTC";
}

/** The contest's club, to check the caller's club role; null when there is no such contest. */
export async function contestClubId(db: Database, contestId: string): Promise<string | null> {
  const [row] = await db.select({ clubId: contests.clubId }).from(contests).where(eq(contests.id, contestId));
  return row?.clubId ?? null;
}

export async function getContest(db: Database, contestId: string) {
  const [contest] = await db.select().from(contests).where(eq(contests.id, contestId));
  if (!contest) return null;
  const all = await db.select({ id: contestRounds.id, number: contestRounds.number, isFlyOff: contestRounds.isFlyOff, task: contestRounds.task })
    .from(contestRounds).where(eq(contestRounds.contestId, contestId)).orderBy(asc(contestRounds.isFlyOff), asc(contestRounds.number));
  const entries = await db.select().from(contestEntries).where(eq(contestEntries.contestId, contestId)).orderBy(asc(contestEntries.createdAt), asc(contestEntries.id));
  const pick = (flyOff: boolean) => all.filter((r) => r.isFlyOff === flyOff).map((r) => ({ id: r.id, number: r.number, task: r.task as TaskDefinition }));
  /** `rounds`: the preliminary rounds (the draw's); `flyOffRounds`: the fly-off's, numbered on their own. */
  return { contest, rounds: pick(false), flyOffRounds: pick(true), entries };
}

/** A pilot enters with models of their own hangar; "taken" when already entered, "models" when a model is not theirs. */
export async function enterPilot(db: Database, p: { contestId: string; userId: string; pilotName: string; modelIds: string[]; pilotClass: "senior" | "junior" }): Promise<EntryRow | "taken" | "models"> {
  const mine = p.modelIds.length === 0 ? [] : await db.select({ id: models.id, name: models.name }).from(models)
    .where(and(eq(models.ownerId, p.userId), inArray(models.id, p.modelIds)));
  if (mine.length !== p.modelIds.length) return "models";
  const ordered = p.modelIds.map((id) => mine.find((m) => m.id === id)!);
  const [row] = await db.insert(contestEntries)
    .values({ contestId: p.contestId, pilotUserId: p.userId, pilotName: p.pilotName, models: ordered, pilotClass: p.pilotClass })
    .onConflictDoNothing().returning();
  return row ?? "taken";
}

export async function addPaperEntry(db: Database, p: { contestId: string; pilotName: string; models: string[]; keepApart: string | null; pilotClass: "senior" | "junior" }): Promise<EntryRow> {
  const [row] = await db.insert(contestEntries).values({
    contestId: p.contestId, pilotName: p.pilotName, paper: true, keepApart: p.keepApart, pilotClass: p.pilotClass,
    models: p.models.map((name) => ({ id: null, name })),
  }).returning();
  return row!;
}

/** The officer sets a live entry's team and/or class (the contest in the WHERE); false when there is no such live entry. */
export async function changeEntry(db: Database, p: { contestId: string; entryId: string; team?: string | null; pilotClass?: "senior" | "junior" }): Promise<boolean> {
  const set = { ...(p.team !== undefined ? { team: p.team } : {}), ...(p.pilotClass ? { pilotClass: p.pilotClass } : {}) };
  const rows = await db.update(contestEntries).set(set)
    .where(and(eq(contestEntries.contestId, p.contestId), eq(contestEntries.id, p.entryId), isNull(contestEntries.withdrawnAt)))
    .returning({ id: contestEntries.id });
  return rows.length > 0;
}

/** Withdraws an entry of this contest (the contest in the WHERE); false when there is none live. */
export async function withdrawEntry(db: Database, p: { contestId: string; entryId: string }): Promise<boolean> {
  const rows = await db.update(contestEntries).set({ withdrawnAt: new Date() })
    .where(and(eq(contestEntries.contestId, p.contestId), eq(contestEntries.id, p.entryId), isNull(contestEntries.withdrawnAt)))
    .returning({ id: contestEntries.id });
  return rows.length > 0;
}

/** The draw's group lists: per round, per group, the entries' ids (preliminary rounds; `flyOff` for the fly-off's). */
export async function listSlots(db: Database, contestId: string, flyOff = false) {
  return db.select({ roundNumber: contestRounds.number, groupNumber: groupSlots.groupNumber, entryId: groupSlots.entryId })
    .from(groupSlots).innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId))
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, flyOff))).orderBy(asc(contestRounds.number), asc(groupSlots.groupNumber));
}

/** Coming contests (from `today`) of every club the user belongs to, soonest first, for Home. */
export async function listMyComingContests(db: Database, p: { userId: string; today: string }) {
  const res = await db.execute<{ id: string; name: string; starts_on: string; club_name: string }>(sql`
    select c.id, c.name, c.starts_on::text as starts_on, k.name as club_name
    from memberships m join contests c on c.club_id = m.club_id join clubs k on k.id = c.club_id
    where m.user_id = ${p.userId} and c.starts_on >= ${p.today}
    order by c.starts_on, c.name limit 10`);
  return res.rows.map((r) => ({ id: r.id, name: r.name, startsOn: r.starts_on, clubName: r.club_name }));
}
