import { and, eq, inArray } from "drizzle-orm";
import type { Database } from "../index";
import { contestEntries, contestPenalties, contestRounds, users } from "../schema";

/**
 * Two officer's penalties in round 3 of the demo contest (invented): Ines gave Dov Ashgrove 100 points
 * for launching in the no-fly time (F3K.9.5), which counts; she gave Elin Tarrow 300 points for a model
 * touching a person in a safety area (F3K.4.3), then removed it (the person was Elin's own helper),
 * recorded with who, when and why. Round 3's page and the results list both. Does nothing when the
 * contest has officer's penalties already.
 */
export async function seedDemoPenalties(db: Database, contestId: string): Promise<void> {
  const [round3] = await db.select({ id: contestRounds.id }).from(contestRounds)
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, false), eq(contestRounds.number, 3)));
  if (!round3) return;
  const [present] = await db.select({ id: contestPenalties.id }).from(contestPenalties).where(eq(contestPenalties.roundId, round3.id)).limit(1);
  if (present) return;
  const entries = await db.select({ id: contestEntries.id, name: contestEntries.pilotName }).from(contestEntries)
    .where(and(eq(contestEntries.contestId, contestId), inArray(contestEntries.pilotName, ["Dov Ashgrove", "Elin Tarrow"])));
  const [officer] = await db.select({ id: users.id }).from(users).where(eq(users.email, "ines@example.com"));
  const dov = entries.find((e) => e.name === "Dov Ashgrove")?.id, elin = entries.find((e) => e.name === "Elin Tarrow")?.id;
  if (!dov || !elin) return;
  await db.insert(contestPenalties).values([
    { roundId: round3.id, entryId: dov, cause: "outside-time", points: 100, note: "Launched before the working-time signal", givenBy: officer?.id ?? null, givenAt: new Date("2027-01-16T13:05:00Z") },
    {
      roundId: round3.id, entryId: elin, cause: "person-in-safety-area", points: 300, note: "Model touched a person at the launch line", givenBy: officer?.id ?? null,
      givenAt: new Date("2027-01-16T13:06:00Z"), removedBy: officer?.id ?? null, removedAt: new Date("2027-01-16T13:25:00Z"), removedReason: "The person was Elin's own helper, not a bystander",
    },
  ]);
}
