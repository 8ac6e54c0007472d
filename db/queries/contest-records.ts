import "server-only";
import { and, asc, eq, inArray, isNull, ne, sql, type SQL } from "drizzle-orm";
import type { Database } from "../index";
import { contestEntries, contestReflights, groupSlots, runLanes, slotRecords, users } from "../schema";

type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];

/** What a slot or a grant holds as its record (the same columns on both tables). */
type HeldRecord = {
  id: string; paperFlights: number[] | null; runId: string | null; lane: number | null; recordedBy: string | null;
  recordedAt: Date | null; signedAt: Date | null; signedFrom: string | null;
};
type Holder = { kind: "slot" | "reflight"; held: HeldRecord };

const recordedByName = (col: typeof groupSlots.recordedBy | typeof contestReflights.recordedBy) => sql<string | null>`(select u.name from users u where u.id = ${col})`;
/** A run lane's flights as derived by lib/results runResult (time in tenths; the round page lists them beside a paper card's). */
export type RecordRunFlight = { timeTenths: number; status: string };
const runFlights = sql<RecordRunFlight[] | null>`${runLanes.derived} -> 'flights'`;
const ofHolder = (h: Holder) => (h.kind === "slot" ? eq(slotRecords.slotId, h.held.id) : eq(slotRecords.reflightId, h.held.id));

/**
 * The round's slots and re-flight grants with a second record waiting for the officer's decision: per
 * pending record the pilot, what it holds (paper flights or a run's lane and its server result) and who
 * recorded it, with the counting record beside it (the round page shows them side by side). A grant's
 * rows carry `reflight: true` and the group the re-flight is flown in.
 */
export async function listPendingRecords(db: Database, roundId: string) {
  const waiting = (holder: SQL) => sql`exists (select 1 from slot_records r where ${holder} and r.outcome is null)`;
  const slotsQuery = db.select({
    holderId: groupSlots.id, entryId: groupSlots.entryId, groupNumber: groupSlots.groupNumber, name: contestEntries.pilotName,
    paperFlights: groupSlots.paperFlights, runId: groupSlots.runId, lane: groupSlots.lane, runResultTenths: runLanes.resultTenths, runFlights,
    recordedAt: groupSlots.recordedAt, recordedBy: recordedByName(groupSlots.recordedBy), signedFrom: groupSlots.signedFrom, signedAt: groupSlots.signedAt,
  }).from(groupSlots).innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .leftJoin(runLanes, and(eq(runLanes.runId, groupSlots.runId), eq(runLanes.lane, groupSlots.lane)))
    .where(and(eq(groupSlots.roundId, roundId), waiting(sql`r.slot_id = ${groupSlots.id}`)))
    .orderBy(asc(groupSlots.groupNumber), asc(contestEntries.pilotName));
  const grantsQuery = db.select({
    holderId: contestReflights.id, entryId: contestReflights.entryId, groupNumber: contestReflights.groupNumber, name: contestEntries.pilotName,
    paperFlights: contestReflights.paperFlights, runId: contestReflights.runId, lane: contestReflights.lane, runResultTenths: runLanes.resultTenths, runFlights,
    recordedAt: contestReflights.recordedAt, recordedBy: recordedByName(contestReflights.recordedBy), signedFrom: contestReflights.signedFrom, signedAt: contestReflights.signedAt,
  }).from(contestReflights).innerJoin(contestEntries, eq(contestEntries.id, contestReflights.entryId))
    .leftJoin(runLanes, and(eq(runLanes.runId, contestReflights.runId), eq(runLanes.lane, contestReflights.lane)))
    .where(and(eq(contestReflights.roundId, roundId), waiting(sql`r.reflight_id = ${contestReflights.id}`)))
    .orderBy(asc(contestReflights.groupNumber), asc(contestEntries.pilotName));
  const othersQuery = db.select({
    id: slotRecords.id, holderId: sql<string>`coalesce(${slotRecords.slotId}, ${slotRecords.reflightId})`, paperFlights: slotRecords.paperFlights, runId: slotRecords.runId, lane: slotRecords.lane,
    runResultTenths: runLanes.resultTenths, runFlights, recordedAt: slotRecords.recordedAt, recordedBy: users.name, signedFrom: slotRecords.signedFrom, signedAt: slotRecords.signedAt,
  }).from(slotRecords)
    .leftJoin(groupSlots, eq(groupSlots.id, slotRecords.slotId))
    .leftJoin(contestReflights, eq(contestReflights.id, slotRecords.reflightId))
    .leftJoin(users, eq(users.id, slotRecords.recordedBy))
    .leftJoin(runLanes, and(eq(runLanes.runId, slotRecords.runId), eq(runLanes.lane, slotRecords.lane)))
    .where(and(sql`coalesce(${groupSlots.roundId}, ${contestReflights.roundId}) = ${roundId}`, isNull(slotRecords.outcome))).orderBy(asc(slotRecords.keptAt));
  const [slots, grants, records] = await Promise.all([slotsQuery, grantsQuery, othersQuery]);
  const withOthers = (h: (typeof slots)[number], reflight: boolean) => ({ ...h, reflight, others: records.filter((r) => r.holderId === h.holderId) });
  return [...slots.map((s) => withOthers(s, false)), ...grants.map((g) => withOthers(g, true))];
}

/** Pilots of these rounds with a record waiting for the officer's decision (a slot's or a grant's), by `${roundId}/${entryId}`: the results show them as undecided. */
export async function undecidedOfRounds(db: Database, roundIds: readonly string[]): Promise<Set<string>> {
  if (roundIds.length === 0) return new Set();
  const rows = await db.selectDistinct({
    roundId: sql<string>`coalesce(${groupSlots.roundId}, ${contestReflights.roundId})`, entryId: sql<string>`coalesce(${groupSlots.entryId}, ${contestReflights.entryId})`,
  }).from(slotRecords)
    .leftJoin(groupSlots, eq(groupSlots.id, slotRecords.slotId))
    .leftJoin(contestReflights, eq(contestReflights.id, slotRecords.reflightId))
    .where(and(isNull(slotRecords.outcome), inArray(sql`coalesce(${groupSlots.roundId}, ${contestReflights.roundId})`, [...roundIds])));
  return new Set(rows.map((r) => `${r.roundId}/${r.entryId}`));
}

/**
 * Decides between a holder's (slot's or grant's) records, with who and when: `recordId` null keeps the
 * counting record (every waiting one is set aside); a waiting record's id makes it the holder's record
 * (paper flights or run lane, with its signature) — through the one result path — and the record it
 * replaces is kept, set aside. "no_record": nothing waits, or no such waiting record of this holder.
 */
async function decideHolder(tx: Tx, h: Holder, p: { userId: string; recordId: string | null }, write: (values: Omit<HeldRecord, "id">) => Promise<unknown>): Promise<"decided" | "no_record"> {
  const decided = { decidedBy: p.userId, decidedAt: new Date() };
  if (p.recordId === null) {
    const done = await tx.update(slotRecords).set({ outcome: "set-aside", ...decided }).where(and(ofHolder(h), isNull(slotRecords.outcome))).returning({ id: slotRecords.id });
    return done.length > 0 ? "decided" : "no_record";
  }
  const [chosen] = await tx.select().from(slotRecords).where(and(eq(slotRecords.id, p.recordId), ofHolder(h), isNull(slotRecords.outcome)));
  if (!chosen) return "no_record";
  const held = h.held;
  if (held.paperFlights !== null || held.runId !== null) {
    await tx.insert(slotRecords).values({
      ...(h.kind === "slot" ? { slotId: held.id } : { reflightId: held.id }),
      paperFlights: held.paperFlights, runId: held.paperFlights !== null ? null : held.runId, lane: held.paperFlights !== null ? null : held.lane,
      recordedBy: held.recordedBy, recordedAt: held.recordedAt, signedAt: held.signedAt, signedFrom: held.signedFrom, outcome: "set-aside", ...decided,
    });
  }
  await write({
    paperFlights: chosen.paperFlights, runId: chosen.runId, lane: chosen.lane, recordedBy: chosen.recordedBy, recordedAt: chosen.recordedAt,
    signedAt: chosen.signedAt, signedFrom: chosen.signedFrom,
  });
  await tx.update(slotRecords).set({ outcome: "counted", ...decided }).where(eq(slotRecords.id, chosen.id));
  await tx.update(slotRecords).set({ outcome: "set-aside", ...decided }).where(and(ofHolder(h), isNull(slotRecords.outcome), ne(slotRecords.id, chosen.id)));
  return "decided";
}

/**
 * The officer's decision on a pilot's records in a round (decideHolder on the pilot's slot).
 * "no_slot": the pilot is not drawn in the round; "no_record": no such waiting record of the slot.
 */
export async function decideRecords(db: Database, p: { roundId: string; entryId: string; userId: string; recordId: string | null }): Promise<"decided" | "no_slot" | "no_record"> {
  return db.transaction(async (tx) => {
    const [slot] = await tx.select().from(groupSlots).where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.entryId, p.entryId))).for("update");
    if (!slot) return "no_slot";
    return decideHolder(tx, { kind: "slot", held: slot }, p, (v) => tx.update(groupSlots).set(v).where(eq(groupSlots.id, slot.id)));
  });
}

/**
 * The officer's decision on a re-flight grant's records (decideHolder on the pilot's grant in the round):
 * the standings then read the chosen record as the re-flight's result, and F3K.9.6 still picks which of
 * the original and the re-flight stands. "not_granted": no grant for the pilot in the round.
 */
export async function decideReflightRecords(db: Database, p: { roundId: string; entryId: string; userId: string; recordId: string | null }): Promise<"decided" | "not_granted" | "no_record"> {
  return db.transaction(async (tx) => {
    const [grant] = await tx.select().from(contestReflights).where(and(eq(contestReflights.roundId, p.roundId), eq(contestReflights.entryId, p.entryId))).for("update");
    if (!grant) return "not_granted";
    return decideHolder(tx, { kind: "reflight", held: grant }, p, (v) => tx.update(contestReflights).set(v).where(eq(contestReflights.id, grant.id)));
  });
}
