import { randomUUID } from "node:crypto";
import { expect } from "vitest";
import { POST as createClubRoute } from "@/app/api/clubs/route";
import { POST as createContestRoute } from "@/app/api/clubs/[slug]/contests/route";
import { POST as paperEntryRoute } from "@/app/api/contests/[contestId]/paper-entries/route";
import { POST as drawRoute } from "@/app/api/contests/[contestId]/draw/route";
import { POST as lockRoute } from "@/app/api/contests/[contestId]/draw/lock/route";
import { listChanges } from "@/db/queries/sync-pull";
import { clubs, contestEntries, contestRounds, contests, memberships } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import type { PullReply } from "@/lib/validations/sync";
import { actAs, type MockSessionUser } from "./session";
import { db, freshUser } from "./db";

/**
 * Shared set-up of the contest integration tests (issue 15), so each file states only what it tests.
 *
 * `clubContest` writes rows directly: fresh accounts (`officer` an officer of the club, `member` and
 * `keeper` members, `flyer` and `stranger` in no club), a club, a contest today with rounds of tasks
 * A, B, D, F, G (F3K.10: at least 5 rounds, all different tasks) and the entries named; no draw.
 * `drawnContest` goes through the routes as an officer: club, contest on 2027-03-06, paper entries,
 * the draw (seed 42), locked when asked.
 */
export type ContestCast = Record<"officer" | "member" | "keeper" | "flyer" | "stranger", MockSessionUser>;

export async function clubContest(prefix: string, o: { club: string; contest: string; pilots: { name: string; user?: "flyer" }[] }) {
  const [officer, member, keeper, flyer, stranger] = await Promise.all(["officer", "member", "keeper", "flyer", "stranger"].map((r) => freshUser(`${prefix}-${r}`)));
  const cast: ContestCast = { officer: officer!, member: member!, keeper: keeper!, flyer: flyer!, stranger: stranger! };
  const [club] = await db.insert(clubs).values({ name: o.club, slug: `${prefix}-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values([
    { clubId: club!.id, userId: cast.officer.id, role: "officer" }, { clubId: club!.id, userId: cast.member.id, role: "member" }, { clubId: club!.id, userId: cast.keeper.id, role: "member" },
  ]);
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: o.contest, startsOn: new Date().toISOString().slice(0, 10), fieldName: "Long Acre", drawSeed: 3 }).returning();
  const rounds = await db.insert(contestRounds).values((["A", "B", "D", "F", "G"] as const).map((l, i) => ({ contestId: c!.id, number: i + 1, task: getCatalogueTask(l) }))).returning();
  const entries = await db.insert(contestEntries).values(o.pilots.map((p) => (p.user ? { contestId: c!.id, pilotName: p.name, pilotUserId: cast[p.user].id } : { contestId: c!.id, pilotName: p.name, paper: true }))).returning();
  return { cast, clubId: club!.id, contestId: c!.id, rounds: rounds.map((r) => r.id), ids: Object.fromEntries(entries.map((e) => [e.pilotName, e.id])) as Record<string, string> };
}

/** The last page of `userId`'s pull from 0 (where the contest duties are). */
export async function lastPage(userId: string): Promise<PullReply> {
  let cursor = "0";
  for (;;) {
    const page = await listChanges(db, { userId, cursor });
    if (!page.hasMore) return page;
    cursor = page.nextCursor;
  }
}

export const json = (body: unknown) =>
  new Request("http://test/api", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
export const reply = async (res: Response) => ({ status: res.status, body: await res.json() });
export const inContest = (contestId: string) => ({ params: Promise.resolve({ contestId }) });

/** Through the routes, as a fresh officer: `clubName`'s club and `cupName` (groups of at most 6), the paper entries, the draw (seed 42), locked with `lock`. */
export async function drawnContest(o: { officerLabel: string; clubName: string; cupName: string; pilots: { pilotName: string; keepApart?: string | null }[]; draw?: boolean; lock?: boolean }) {
  const officer = await freshUser(o.officerLabel);
  actAs(officer);
  const club = await reply(await createClubRoute(json({ name: o.clubName })));
  const made = await reply(await createContestRoute(json({
    name: o.cupName, startsOn: "2027-03-06", fieldName: "Willow Flats", rounds: ["A", "B", "D", "F", "G"].map((letter) => ({ letter })),
    maxGroupSize: 6, prepMinutes: 5, noFlySeconds: 60, dropRule: "f3k", practice: false,
  }), { params: Promise.resolve({ slug: club.body.club.slug as string }) }));
  expect(made.status).toBe(201);
  const contestId = made.body.contest.id as string;
  for (const p of o.pilots) expect((await paperEntryRoute(json(p), inContest(contestId))).status).toBe(201);
  if (o.draw !== false) expect((await drawRoute(json({ seed: 42 }), inContest(contestId))).status).toBe(201);
  if (o.draw !== false && o.lock) expect((await lockRoute(json({}), inContest(contestId))).status).toBe(200);
  return { officer, contestId };
}
