import { and, eq, inArray } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { drawEntries } from "@/lib/contests/entries-draw";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import type { Database } from "../index";
import { saveDraw } from "../queries/contest-draw";
import { swapInRound } from "../queries/contest-draw-changes";
import { clubs, contestEntries, contestRounds, contests, users } from "../schema";
import { DEMO_CLUB } from "./demo-people";
import { seedDemoResults } from "./demo-results";
import { seedDemoFees } from "./demo-fees";
import { seedDemoDisputes } from "./demo-disputes";
import { seedDemoPenalties } from "./demo-penalties";
import { seedDemoPhoneSetAside } from "./demo-phone-set-aside";
import { seedDemoRecords, seedDemoReflightRecords } from "./demo-records";
import { seedDemoReflightRequest, seedDemoReflights } from "./demo-reflights";
import { seedDemoTimekeepers } from "./demo-timekeepers";

const NAME = "Heronmoor Winter Cup";
/** Invented pilots entered on paper (any likeness is chance). */
const PAPER = ["Oren Halloway", "Bea Quillfeather", "Cass Merriden", "Dov Ashgrove", "Elin Tarrow", "Finn Brackley", "Gus Wendle", "Hana Roskell", "Ivo Pettaway"];

/**
 * A demo contest of the demo club: 5 rounds, the demo pilots and 9 paper entries, drawn (seed
 * 20261212), not locked; with an entry fee (demo-fees.ts); rounds 1–3 with results
 * (./demo-results.ts); in round 5 the officer had Gus Wendle trade groups with a pilot of another
 * group (a change of the draw, listed under it); round 1 with its timekeepers (./demo-timekeepers.ts); a
 * re-flight in round 2 (./demo-reflights.ts); two records of one pilot in round 1 and of the round-2 re-flight (./demo-records.ts);
 * two disputes (./demo-disputes.ts: one upheld by that re-flight, one open in round 3);
 * two officer's penalties in round 3 (./demo-penalties.ts: one counting, one removed);
 * a fly-off planned for the best 5 in 3 rounds (tasks M, A, B), not drawn yet: rounds 4 and 5 are
 * still to be scored, so the contest page shows why the officer cannot draw it yet.
 */
export async function seedDemoContest(db: Database): Promise<void> {
  const contestId = await seedContest(db);
  await seedDemoFees(db, NAME);
  if (contestId) await seedDemoTimekeepers(db, contestId);
  if (contestId) await seedDemoReflights(db, contestId);
  if (contestId) await seedDemoReflightRequest(db, contestId);
  if (contestId) await seedDemoRecords(db, contestId);
  if (contestId) await seedDemoReflightRecords(db, contestId);
  if (contestId) await seedDemoDisputes(db, contestId);
  if (contestId) await seedDemoPenalties(db, contestId);
  if (contestId) await seedDemoPhoneSetAside(db, contestId);
  if (contestId) await seedDemoFlyOff(db, contestId);
}

/** The demo contest's planned fly-off (F3K.10: 3–6 rounds; task M is flown in fly-offs only); added once. */
async function seedDemoFlyOff(db: Database, contestId: string): Promise<void> {
  const [planned] = await db.select({ id: contestRounds.id }).from(contestRounds)
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, true))).limit(1);
  if (planned) return;
  await db.update(contests).set({ flyOffPilots: 5 }).where(eq(contests.id, contestId));
  await db.insert(contestRounds).values((["M", "A", "B"] as const).map((l, i) => ({ contestId, number: i + 1, isFlyOff: true, task: getCatalogueTask(l) })));
}

async function seedContest(db: Database): Promise<string | null> {
  const [club] = await db.select({ id: clubs.id }).from(clubs).where(eq(clubs.slug, DEMO_CLUB.slug));
  if (!club) return null;
  const [present] = await db.select({ id: contests.id }).from(contests).where(and(eq(contests.clubId, club.id), eq(contests.name, NAME)));
  if (present) {
    await seedDemoResults(db, present.id);
    return present.id;
  }
  const pilots = await db.select({ id: users.id, name: users.name }).from(users)
    .where(inArray(users.email, ["ada@example.com", "tobi@example.com", "lena@example.com"]));
  const officer = await db.select({ id: users.id }).from(users).where(eq(users.email, "ines@example.com"));
  const [contest] = await db.insert(contests).values({
    clubId: club.id, name: NAME, startsOn: "2027-01-16", fieldName: DEMO_CLUB.homeField, status: "open", maxGroupSize: 6, createdBy: officer[0]?.id ?? null,
  }).returning();
  await db.insert(contestRounds).values((["A", "B", "D", "F", "H"] as const).map((l, i) => ({ contestId: contest!.id, number: i + 1, task: getCatalogueTask(l) })));
  // The draw orders entries by id: ids handed out in this fixed order make the demo draw the same on
  // every install (random ids once gave round 2's card penalty to a different pilot on each seed).
  const rows = [
    ...[...pilots].sort((a, b) => a.name.localeCompare(b.name)).map((p) => ({ contestId: contest!.id, pilotUserId: p.id, pilotName: p.name })),
    ...PAPER.map((pilotName, i) => ({ contestId: contest!.id, pilotName, paper: true, keepApart: i < 2 ? "shared timekeeper" : null })),
  ];
  const ids = rows.map(() => uuidv7()).sort();
  const entries = await db.insert(contestEntries).values(rows.map((r, i) => ({ ...r, id: ids[i]! }))).returning();
  const seed = 20261212;
  const drawn = drawEntries({ entries, rounds: [1, 2, 3, 4, 5], maxGroupSize: 6, seed });
  await saveDraw(db, { contestId: contest!.id, seed, rounds: drawn.rounds, replaceResults: false });
  const round5 = drawn.rounds.find((r) => r.roundNumber === 5)!.groups;
  const gus = entries.find((e) => e.pilotName === "Gus Wendle")!;
  const other = round5.find((g) => !g.includes(gus.id))!.map((id) => entries.find((e) => e.id === id)!).find((e) => e.keepApart === null)!;
  if (officer[0]) await swapInRound(db, { contestId: contest!.id, roundNumber: 5, a: gus.id, b: other.id, byUserId: officer[0].id });
  await seedDemoResults(db, contest!.id);
  return contest!.id;
}
