import { and, asc, eq } from "drizzle-orm";
import type { Database } from "../index";
import { contestEntries, contestReflights, contestRounds, groupSlots, users } from "../schema";

/**
 * A re-flight in round 2 of the demo contest (invented): the organiser's timer failed for Bea
 * Quillfeather, so the officer (Ines) granted her a re-flight in a later group, or with her group at
 * the end of the round when hers flew last (F3K.9.6); its paper card is recorded and signed. Round 2's
 * page lists it; the results page lists it with who and when. Mara times it (a re-flight duty on her
 * phone; she flies in no group). Does nothing when it is there already.
 */
export async function seedDemoReflights(db: Database, contestId: string): Promise<void> {
  const [round] = await db.select({ id: contestRounds.id }).from(contestRounds)
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.number, 2), eq(contestRounds.isFlyOff, false)));
  const [bea] = await db.select({ id: contestEntries.id }).from(contestEntries).where(and(eq(contestEntries.contestId, contestId), eq(contestEntries.pilotName, "Bea Quillfeather")));
  if (!round || !bea) return;
  const slots = await db.select({ entryId: groupSlots.entryId, groupNumber: groupSlots.groupNumber }).from(groupSlots).where(eq(groupSlots.roundId, round.id)).orderBy(asc(groupSlots.groupNumber));
  const own = slots.find((s) => s.entryId === bea.id)?.groupNumber;
  if (own === undefined) return;
  const last = Math.max(...slots.map((s) => s.groupNumber));
  const [officer] = await db.select({ id: users.id }).from(users).where(eq(users.email, "ines@example.com"));
  const [keeper] = await db.select({ id: users.id }).from(users).where(eq(users.email, "mara@example.com"));
  const at = new Date("2027-01-16T11:40:00Z");
  await db.insert(contestReflights).values({
    roundId: round.id, entryId: bea.id, cause: "organiser", placement: own < last ? "later-group" : "original-group", groupNumber: own < last ? own + 1 : own,
    reason: "The group's horn failed at the start of working time", grantedBy: officer?.id ?? null, grantedAt: at,
    paperFlights: [1412, 1655, 1730], recordedBy: officer?.id ?? null, recordedAt: new Date("2027-01-16T12:05:00Z"),
    signedAt: new Date("2027-01-16T12:05:00Z"), signedFrom: "marked by an officer",
    timekeeperUserId: keeper?.id ?? null, timekeeperAssignedBy: officer?.id ?? null, timekeeperAssignedAt: keeper ? at : null,
  }).onConflictDoNothing();
}
