import { and, eq } from "drizzle-orm";
import type { Database } from "../index";
import { contestEntries, contestRounds, groupSlots, slotRecords, users } from "../schema";

/**
 * Two records for one pilot in round 1 of the demo contest (invented): Oren Halloway's card was
 * entered twice by the officer with different times, and the first entry is kept beside the one
 * counting, waiting for the officer's decision on round 1's page. Does nothing when a record of his is kept already.
 */
export async function seedDemoRecords(db: Database, contestId: string): Promise<void> {
  const [slot] = await db.select({ id: groupSlots.id }).from(groupSlots)
    .innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId))
    .innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.number, 1), eq(contestRounds.isFlyOff, false), eq(contestEntries.pilotName, "Oren Halloway")));
  if (!slot) return;
  const [kept] = await db.select({ id: slotRecords.id }).from(slotRecords).where(eq(slotRecords.slotId, slot.id)).limit(1);
  if (kept) return;
  const [officer] = await db.select({ id: users.id }).from(users).where(eq(users.email, "ines@example.com"));
  const at = new Date("2027-01-16T10:50:00Z");
  await db.insert(slotRecords).values({
    slotId: slot.id, paperFlights: [984, 2113], recordedBy: officer?.id ?? null, recordedAt: at, signedAt: at, signedFrom: "paper card", keptAt: new Date("2027-01-16T11:00:00Z"),
  });
}
