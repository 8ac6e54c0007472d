import { and, asc, eq } from "drizzle-orm";
import type { Database } from "../index";
import { randomUUID } from "node:crypto";
import { contestEntries, contestReflightRequests, contestReflights, contestRounds, groupSlots, users } from "../schema";

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

/**
 * A re-flight asked for on a timekeeper's phone in round 1 of the demo contest (invented): the timekeeper of
 * round 1's first pilot ruled a launch collision (F3K.4.2), waiting for the officer's decision on round 1's
 * page. The run and event it came from are not part of the demo (their ids are invented). Does nothing when
 * round 1 has a request already. Run after the timekeepers (./demo-timekeepers.ts).
 */
export async function seedDemoReflightRequest(db: Database, contestId: string): Promise<void> {
  const [round] = await db.select({ id: contestRounds.id }).from(contestRounds)
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.number, 1), eq(contestRounds.isFlyOff, false)));
  if (!round) return;
  const [has] = await db.select({ id: contestReflightRequests.id }).from(contestReflightRequests).where(eq(contestReflightRequests.roundId, round.id)).limit(1);
  if (has) return;
  const [slot] = await db.select({ entryId: groupSlots.entryId, keeper: groupSlots.timekeeperUserId }).from(groupSlots)
    .innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .where(eq(groupSlots.roundId, round.id)).orderBy(asc(groupSlots.groupNumber), asc(contestEntries.pilotName)).limit(1);
  if (!slot) return;
  await db.insert(contestReflightRequests).values({
    roundId: round.id, entryId: slot.entryId, eventId: randomUUID(), runId: randomUUID(), lane: 0, cause: "launch-collision", placement: "original-group",
    reason: "Two models touched on launch", askedBy: slot.keeper, askedAt: new Date("2027-01-16T09:12:00Z"),
  });
}
