import { asc, eq } from "drizzle-orm";
import type { Tx } from "../queries/sync-db";
import { contestEntries, contestRounds, contests, fieldSessions, groupSlots, runs } from "../schema";

/**
 * One invented club contest in the demo season, so the Season screen's "practice or contest"
 * filter has both: the runs of the pilot's tenth session become the rounds of the contest's draw
 * (group_slots.run_id names each run). Everything else stays practice.
 */
export async function seedSeasonContest(tx: Tx, p: { clubId: string; field: string; pilot: { id: string; name: string } }) {
  const sessions = await tx.select({ id: fieldSessions.id, startedAt: fieldSessions.startedAt })
    .from(fieldSessions).where(eq(fieldSessions.ownerId, p.pilot.id)).orderBy(asc(fieldSessions.startedAt));
  const session = sessions[9];
  if (!session) return;
  const day = session.startedAt.toISOString().slice(0, 10);
  const [contest] = await tx.insert(contests)
    .values({ clubId: p.clubId, name: "Heronmoor Summer Open", startsOn: day, fieldName: p.field, status: "finished" }).returning();
  const [entry] = await tx.insert(contestEntries)
    .values({ contestId: contest!.id, pilotUserId: p.pilot.id, pilotName: p.pilot.name, paymentStatus: "paid" }).returning();
  const flown = await tx.select({ id: runs.id, task: runs.task }).from(runs).where(eq(runs.sessionId, session.id)).orderBy(asc(runs.createdAt));
  for (const [i, run] of flown.entries()) {
    const [round] = await tx.insert(contestRounds).values({ contestId: contest!.id, number: i + 1, task: run.task }).returning();
    // signed on the day's paper card (F3K.1.2: an unsigned result would score zero in the standings)
    await tx.insert(groupSlots).values({ roundId: round!.id, groupNumber: 1, entryId: entry!.id, runId: run.id, lane: 0, signedAt: session.startedAt, signedFrom: "paper card" });
  }
}
