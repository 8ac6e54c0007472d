import "server-only";
import { and, asc, desc, eq, inArray, isNotNull, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { lodgedAtProblem, type DisputeAction } from "@/lib/contests/disputes";
import type { Database } from "../index";
import { contestDisputes, contestEntries, contestReflights, contestRounds, contests, groupSlots, slotRecords, users } from "../schema";

/**
 * Records a dispute about a pilot's result in the round, lodged by `lodgedBy` (as named) at `lodgedAt`
 * (absent: now), with the officer who recorded it and when (`recorded_at`). "no_slot" when the pilot
 * is not drawn in the round; `{ problem }` when the lodged time given is in the future or too early
 * (lib/contests/disputes.ts lodgedAtProblem).
 */
export async function lodgeDispute(db: Database, p: {
  roundId: string; entryId: string; userId: string; subject: string; lodgedBy: string; lodgedAt?: string;
}): Promise<{ id: string } | "no_slot" | { problem: string }> {
  const [slot] = await db.select({ id: groupSlots.id, startsOn: contests.startsOn }).from(groupSlots)
    .innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId)).innerJoin(contests, eq(contests.id, contestRounds.contestId))
    .where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.entryId, p.entryId)));
  if (!slot) return "no_slot";
  const now = new Date();
  const lodgedAt = p.lodgedAt === undefined ? now : new Date(p.lodgedAt);
  // a time the officer gives is checked; none given is the moment it is recorded, whatever the contest's date
  const problem = p.lodgedAt === undefined ? null : lodgedAtProblem(lodgedAt, now, slot.startsOn);
  if (problem) return { problem };
  const [row] = await db.insert(contestDisputes).values({
    roundId: p.roundId, entryId: p.entryId, subject: p.subject, lodgedBy: p.lodgedBy, lodgedAt, recordedAt: now, recordedBy: p.userId,
  }).returning({ id: contestDisputes.id });
  return { id: row!.id };
}

/**
 * Resolves an open dispute of the round (upheld or rejected, the outcome, who and when). An upheld
 * dispute carried out by a re-flight needs the pilot's re-flight in this round granted first, and one
 * carried out by a decision between records needs that decision made ("no_action"): the dispute links
 * to the action, it does not change the result itself. "not_found" for a dispute not in this round;
 * "resolved_already" when it is not open (its first resolution stands).
 */
export async function resolveDispute(db: Database, p: {
  roundId: string; disputeId: string; userId: string; status: "upheld" | "rejected"; outcome: string; action: DisputeAction | null;
}): Promise<"resolved" | "not_found" | "resolved_already" | "no_action"> {
  return db.transaction(async (tx) => {
    const [d] = await tx.select({ entryId: contestDisputes.entryId, status: contestDisputes.status }).from(contestDisputes)
      .where(and(eq(contestDisputes.id, p.disputeId), eq(contestDisputes.roundId, p.roundId))).for("update");
    if (!d) return "not_found";
    if (d.status !== "open") return "resolved_already";
    if (p.action === "reflight") {
      const [r] = await tx.select({ id: contestReflights.id }).from(contestReflights).where(and(eq(contestReflights.roundId, p.roundId), eq(contestReflights.entryId, d.entryId)));
      if (!r) return "no_action";
    }
    if (p.action === "record-decision") {
      // a decision between the slot's records or between the re-flight grant's
      const [r] = await tx.select({ id: slotRecords.id }).from(slotRecords)
        .leftJoin(groupSlots, eq(groupSlots.id, slotRecords.slotId)).leftJoin(contestReflights, eq(contestReflights.id, slotRecords.reflightId))
        .where(and(
          sql`coalesce(${groupSlots.roundId}, ${contestReflights.roundId}) = ${p.roundId}`, sql`coalesce(${groupSlots.entryId}, ${contestReflights.entryId}) = ${d.entryId}`,
          isNotNull(slotRecords.outcome),
        )).limit(1);
      if (!r) return "no_action";
    }
    await tx.update(contestDisputes).set({ status: p.status, outcome: p.outcome, action: p.action, resolvedBy: p.userId, resolvedAt: new Date() })
      .where(eq(contestDisputes.id, p.disputeId));
    return "resolved";
  });
}

const lodger = alias(users, "dispute_recorder");
const resolver = alias(users, "dispute_resolver");

/** Disputes with the pilot, the round, who recorded and resolved them (officers' lists), open ones first, then newest. */
function disputeRows(db: Database) {
  return db.select({
    id: contestDisputes.id, roundNumber: contestRounds.number, isFlyOff: contestRounds.isFlyOff, entryId: contestDisputes.entryId, name: contestEntries.pilotName,
    subject: contestDisputes.subject, lodgedBy: contestDisputes.lodgedBy, lodgedAt: contestDisputes.lodgedAt, recordedAt: contestDisputes.recordedAt, recordedBy: lodger.name,
    status: contestDisputes.status, outcome: contestDisputes.outcome, action: contestDisputes.action, resolvedBy: resolver.name, resolvedAt: contestDisputes.resolvedAt,
  }).from(contestDisputes)
    .innerJoin(contestRounds, eq(contestRounds.id, contestDisputes.roundId))
    .innerJoin(contestEntries, eq(contestEntries.id, contestDisputes.entryId))
    .leftJoin(lodger, eq(lodger.id, contestDisputes.recordedBy))
    .leftJoin(resolver, eq(resolver.id, contestDisputes.resolvedBy));
}
const openFirst = sql`case when ${contestDisputes.status} = 'open' then 0 else 1 end`;

/** The round's disputes (the round page). */
export async function listRoundDisputes(db: Database, roundId: string) {
  return disputeRows(db).where(eq(contestDisputes.roundId, roundId)).orderBy(openFirst, desc(contestDisputes.lodgedAt));
}

/** Every dispute of the contest (the officers' list on the contest page). */
export async function listContestDisputes(db: Database, contestId: string) {
  return disputeRows(db).where(eq(contestRounds.contestId, contestId))
    .orderBy(openFirst, asc(contestRounds.isFlyOff), asc(contestRounds.number), desc(contestDisputes.lodgedAt));
}

/** The slots of these rounds with an open dispute ("roundId/entryId"): the standings mark them, without names. */
export async function openDisputesOfRounds(db: Database, roundIds: readonly string[]): Promise<Set<string>> {
  if (roundIds.length === 0) return new Set();
  const rows = await db.selectDistinct({ roundId: contestDisputes.roundId, entryId: contestDisputes.entryId }).from(contestDisputes)
    .where(and(inArray(contestDisputes.roundId, [...roundIds]), eq(contestDisputes.status, "open")));
  return new Set(rows.map((r) => `${r.roundId}/${r.entryId}`));
}
