import "server-only";
import { and, asc, eq, isNull, ne, sql } from "drizzle-orm";
import type { Database } from "../index";
import { contestEntries, groupSlots, runLanes, slotRecords, users } from "../schema";

/**
 * The round's slots with a second record waiting for the officer's decision: per pending record the
 * pilot, what it holds (paper flights or a run's lane and its server result) and who recorded it, with
 * the slot's counting record beside it (the round page shows them side by side).
 */
export async function listPendingRecords(db: Database, roundId: string) {
  const current = db.select({
    slotId: groupSlots.id, entryId: groupSlots.entryId, groupNumber: groupSlots.groupNumber, name: contestEntries.pilotName,
    paperFlights: groupSlots.paperFlights, runId: groupSlots.runId, lane: groupSlots.lane, runResultTenths: runLanes.resultTenths,
    recordedAt: groupSlots.recordedAt, recordedBy: sql<string | null>`(select u.name from users u where u.id = ${groupSlots.recordedBy})`,
    signedFrom: groupSlots.signedFrom, signedAt: groupSlots.signedAt,
  }).from(groupSlots).innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .leftJoin(runLanes, and(eq(runLanes.runId, groupSlots.runId), eq(runLanes.lane, groupSlots.lane)))
    .where(and(eq(groupSlots.roundId, roundId), sql`exists (select 1 from slot_records r where r.slot_id = ${groupSlots.id} and r.outcome is null)`))
    .orderBy(asc(groupSlots.groupNumber), asc(contestEntries.pilotName));
  const others = db.select({
    id: slotRecords.id, slotId: slotRecords.slotId, paperFlights: slotRecords.paperFlights, runId: slotRecords.runId, lane: slotRecords.lane,
    runResultTenths: runLanes.resultTenths, recordedAt: slotRecords.recordedAt, recordedBy: users.name, signedFrom: slotRecords.signedFrom, signedAt: slotRecords.signedAt,
  }).from(slotRecords).innerJoin(groupSlots, eq(groupSlots.id, slotRecords.slotId))
    .leftJoin(users, eq(users.id, slotRecords.recordedBy))
    .leftJoin(runLanes, and(eq(runLanes.runId, slotRecords.runId), eq(runLanes.lane, slotRecords.lane)))
    .where(and(eq(groupSlots.roundId, roundId), isNull(slotRecords.outcome))).orderBy(asc(slotRecords.keptAt));
  const [slots, records] = await Promise.all([current, others]);
  return slots.map((s) => ({ ...s, others: records.filter((r) => r.slotId === s.slotId) }));
}

/**
 * The officer's decision on a pilot's records in a round, with who and when: `recordId` null keeps
 * the slot's counting record (every waiting one is set aside); a waiting record's id makes it the
 * slot's record (paper flights or run lane, with its signature) — through the one result path, the
 * slot (run_lanes.result_tenths or the paper card) — and the record it replaces is kept, set aside.
 * "no_slot": the pilot is not drawn in the round; "no_record": no such waiting record of the slot.
 */
export async function decideRecords(db: Database, p: { roundId: string; entryId: string; userId: string; recordId: string | null }): Promise<"decided" | "no_slot" | "no_record"> {
  return db.transaction(async (tx) => {
    const [slot] = await tx.select().from(groupSlots).where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.entryId, p.entryId))).for("update");
    if (!slot) return "no_slot";
    const now = new Date();
    const decided = { decidedBy: p.userId, decidedAt: now };
    if (p.recordId === null) {
      const done = await tx.update(slotRecords).set({ outcome: "set-aside", ...decided }).where(and(eq(slotRecords.slotId, slot.id), isNull(slotRecords.outcome))).returning({ id: slotRecords.id });
      return done.length > 0 ? "decided" : "no_record";
    }
    const [chosen] = await tx.select().from(slotRecords).where(and(eq(slotRecords.id, p.recordId), eq(slotRecords.slotId, slot.id), isNull(slotRecords.outcome)));
    if (!chosen) return "no_record";
    if (slot.paperFlights !== null || slot.runId !== null) {
      await tx.insert(slotRecords).values({
        slotId: slot.id, paperFlights: slot.paperFlights, runId: slot.paperFlights !== null ? null : slot.runId, lane: slot.paperFlights !== null ? null : slot.lane,
        recordedBy: slot.recordedBy, recordedAt: slot.recordedAt, signedAt: slot.signedAt, signedFrom: slot.signedFrom, outcome: "set-aside", ...decided,
      });
    }
    await tx.update(groupSlots).set({
      paperFlights: chosen.paperFlights, runId: chosen.runId, lane: chosen.lane, recordedBy: chosen.recordedBy, recordedAt: chosen.recordedAt,
      signedAt: chosen.signedAt, signedFrom: chosen.signedFrom,
    }).where(eq(groupSlots.id, slot.id));
    await tx.update(slotRecords).set({ outcome: "counted", ...decided }).where(eq(slotRecords.id, chosen.id));
    await tx.update(slotRecords).set({ outcome: "set-aside", ...decided }).where(and(eq(slotRecords.slotId, slot.id), isNull(slotRecords.outcome), ne(slotRecords.id, chosen.id)));
    return "decided";
  });
}
