import { and, asc, eq, inArray, isNotNull } from "drizzle-orm";
import type { Database } from "../index";
import { contestEntries, contestRounds, groupSlots, users } from "../schema";

/** Demo accounts who keep time, in this order of preference (the coach first: she does not fly). */
const KEEPERS = ["mara@example.com", "ines@example.com", "ada@example.com", "tobi@example.com", "lena@example.com"];

/**
 * Round 1 of the demo contest gets its timekeepers, assigned by the officer: for each group, the
 * first demo account that does not fly in it times up to four of its pilots, the next the rest.
 * Does nothing when round 1 has a timekeeper already.
 */
export async function seedDemoTimekeepers(db: Database, contestId: string): Promise<void> {
  const [round] = await db.select({ id: contestRounds.id }).from(contestRounds)
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.number, 1), eq(contestRounds.isFlyOff, false)));
  if (!round) return;
  const done = await db.select({ id: groupSlots.id }).from(groupSlots).where(and(eq(groupSlots.roundId, round.id), isNotNull(groupSlots.timekeeperUserId))).limit(1);
  if (done.length > 0) return;
  const people = await db.select({ id: users.id, email: users.email }).from(users).where(inArray(users.email, KEEPERS));
  const keepers = KEEPERS.flatMap((e) => people.filter((p) => p.email === e).map((p) => p.id));
  const officer = people.find((p) => p.email === "ines@example.com")?.id ?? null;
  const slots = await db.select({ entryId: groupSlots.entryId, groupNumber: groupSlots.groupNumber, pilotUserId: contestEntries.pilotUserId })
    .from(groupSlots).innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .where(eq(groupSlots.roundId, round.id)).orderBy(asc(groupSlots.groupNumber), asc(contestEntries.pilotName));
  const at = new Date("2027-01-16T08:30:00Z");
  for (const g of [...new Set(slots.map((s) => s.groupNumber))]) {
    const pilots = slots.filter((s) => s.groupNumber === g);
    const flying = new Set(pilots.map((p) => p.pilotUserId));
    const free = keepers.filter((k) => !flying.has(k));
    for (const [i, p] of pilots.entries()) {
      const keeper = free[Math.floor(i / 4)];
      if (!keeper) break;
      await db.update(groupSlots).set({ timekeeperUserId: keeper, timekeeperAssignedBy: officer, timekeeperAssignedAt: at })
        .where(and(eq(groupSlots.roundId, round.id), eq(groupSlots.entryId, p.entryId)));
    }
  }
}
