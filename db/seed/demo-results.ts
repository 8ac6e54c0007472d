import { and, asc, eq, inArray, isNotNull } from "drizzle-orm";
import { mulberry32 } from "@/lib/random";
import type { TaskDefinition } from "@/lib/tasks/definition";
import type { Database } from "../index";
import { contestEntries, contestRounds, groupSlots, users } from "../schema";

/** Invented teams of the demo contest (F3K.10.4 ranks each team's three best). */
const TEAMS: Record<string, string> = {
  "Oren Halloway": "Marsh Larks", "Bea Quillfeather": "Marsh Larks", "Cass Merriden": "Marsh Larks", "Dov Ashgrove": "Marsh Larks",
  "Elin Tarrow": "Hill Kites", "Finn Brackley": "Hill Kites", "Gus Wendle": "Hill Kites",
};

/** Invented pilots of the demo contest who fly as juniors (ranked among themselves too). */
const JUNIORS = new Set(["Finn Brackley", "Gus Wendle"]);

/** Invented paper-card flight times (tenths of a second) for a round's task, from the seeded generator. */
function cardFor(task: TaskDefinition, next: () => number): number[] {
  const between = (lo: number, hi: number) => Math.round(lo + next() * (hi - lo)) * 10 + Math.floor(next() * 10);
  if (task.letter === "A") return [between(60, 140), between(150, 300)];
  if (task.letter === "B") return [between(90, 200), between(120, 240), between(120, 240)];
  if (task.letter === "D") return [between(150, 300), between(150, 300)];
  return [between(60, 120), between(90, 180), between(90, 180)];
}

/**
 * Results for the first three rounds of the demo contest, entered as from paper cards by its
 * officer: signed, except one card in round 3 (scores zero, F3K.1.2), and one 100-point penalty;
 * teams for seven pilots, two of them juniors. Does nothing when a result is already recorded.
 */
export async function seedDemoResults(db: Database, contestId: string): Promise<void> {
  const rounds = await db.select({ id: contestRounds.id, number: contestRounds.number, task: contestRounds.task }).from(contestRounds)
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, false))).orderBy(asc(contestRounds.number));
  const first = rounds.filter((r) => r.number <= 3);
  if (first.length === 0) return;
  const recorded = await db.select({ id: groupSlots.id }).from(groupSlots)
    .where(and(inArray(groupSlots.roundId, rounds.map((r) => r.id)), isNotNull(groupSlots.recordedAt))).limit(1);
  if (recorded.length > 0) return;
  const [officer] = await db.select({ id: users.id }).from(users).where(eq(users.email, "ines@example.com"));
  const entries = await db.select({ id: contestEntries.id, name: contestEntries.pilotName }).from(contestEntries).where(eq(contestEntries.contestId, contestId));
  for (const e of entries) if (TEAMS[e.name]) await db.update(contestEntries).set({ team: TEAMS[e.name], pilotClass: JUNIORS.has(e.name) ? "junior" : "senior" }).where(eq(contestEntries.id, e.id));
  const next = mulberry32(20270116);
  const at = new Date("2027-01-16T11:00:00Z");
  for (const round of first) {
    const slots = await db.select({ id: groupSlots.id, entryId: groupSlots.entryId }).from(groupSlots).where(eq(groupSlots.roundId, round.id)).orderBy(asc(groupSlots.groupNumber), asc(groupSlots.entryId));
    for (const [i, slot] of slots.entries()) {
      const unsigned = round.number === 3 && i === 0;
      await db.update(groupSlots).set({
        paperFlights: cardFor(round.task as TaskDefinition, next),
        penaltyPoints: round.number === 2 && i === 1 ? 100 : 0,
        recordedBy: officer?.id ?? null, recordedAt: at,
        signedAt: unsigned ? null : at, signedFrom: unsigned ? null : "paper card",
      }).where(eq(groupSlots.id, slot.id));
    }
  }
}
