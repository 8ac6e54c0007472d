import { and, eq, inArray } from "drizzle-orm";
import type { Database } from "../index";
import { contestDisputes, contestEntries, contestRounds, users } from "../schema";

/**
 * Two disputes in the demo contest (invented): in round 2, Bea Quillfeather protested that the horn
 * failed at the start of her working time; Ines (the officer) upheld it and carried it out with the
 * re-flight of ./demo-reflights.ts. In round 3, the team manager of Cass Merriden disputes a flight
 * the timekeeper did not count; it is still open, so the standings mark that result "under dispute".
 * Does nothing when the contest has disputes already.
 */
export async function seedDemoDisputes(db: Database, contestId: string): Promise<void> {
  const rounds = await db.select({ id: contestRounds.id, number: contestRounds.number }).from(contestRounds)
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, false), inArray(contestRounds.number, [2, 3])));
  const [present] = await db.select({ id: contestDisputes.id }).from(contestDisputes).where(inArray(contestDisputes.roundId, rounds.map((r) => r.id))).limit(1);
  if (present) return;
  const entries = await db.select({ id: contestEntries.id, name: contestEntries.pilotName }).from(contestEntries)
    .where(and(eq(contestEntries.contestId, contestId), inArray(contestEntries.pilotName, ["Bea Quillfeather", "Cass Merriden"])));
  const [officer] = await db.select({ id: users.id }).from(users).where(eq(users.email, "ines@example.com"));
  const round = (n: number) => rounds.find((r) => r.number === n)?.id;
  const entry = (name: string) => entries.find((e) => e.name === name)?.id;
  const bea = entry("Bea Quillfeather"), cass = entry("Cass Merriden"), round2 = round(2), round3 = round(3);
  if (!bea || !cass || !round2 || !round3) return;
  await db.insert(contestDisputes).values([
    {
      roundId: round2, entryId: bea, subject: "The horn did not sound at the start of working time; my first launch was late",
      lodgedBy: "Bea Quillfeather (pilot)", lodgedAt: new Date("2027-01-16T11:35:00Z"), recordedBy: officer?.id ?? null,
      status: "upheld", outcome: "Upheld: the horn failed for the whole group; a re-flight is granted (F3K.9.6)", action: "reflight",
      resolvedBy: officer?.id ?? null, resolvedAt: new Date("2027-01-16T11:41:00Z"),
    },
    {
      roundId: round3, entryId: cass, subject: "The second flight landed inside the working time but was not counted",
      lodgedBy: "Team manager of Cass Merriden", lodgedAt: new Date("2027-01-16T13:20:00Z"), recordedBy: officer?.id ?? null,
    },
  ]);
}
