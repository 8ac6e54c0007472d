import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { StandingsInput, StandingsSlot } from "@/lib/contests/standings";
import type { TaskDefinition } from "@/lib/tasks/definition";
import type { Database } from "../index";
import { contestEntries, contestRounds, contests, groupSlots, runLanes } from "../schema";
import { listLinkableLanes } from "./contest-lanes";
import { openDisputesOfRounds } from "./contest-disputes";
import { officerPenaltiesOfRounds } from "./contest-penalties";
import { undecidedOfRounds } from "./contest-records";
import { reflightsOfRounds } from "./contest-reflights";
import { requestsFromLinkedLane } from "./contest-reflight-requests";

export type ResultsData = {
  contest: { id: string; name: string; startsOn: string; fieldName: string; dropRule: string; clubId: string; publicToken: string | null; flyOffPilots: number | null };
  input: StandingsInput;
  /** Each slot's flights as recorded: a paper card's times, or the linked run lane's derived flights. */
  flights: { roundId: string; groupNumber: number; entryId: string; runFlights: { timeTenths: number; creditedTenths: number; status: string; reason: string | null }[] | null }[];
};

/** Everything the standings are computed from: rounds (fly-off too), entries, slots with the linked run lane's server result. */
export async function getResultsData(db: Database, contestId: string): Promise<ResultsData | null> {
  const [c] = await db.select().from(contests).where(eq(contests.id, contestId));
  if (!c) return null;
  const rounds = await db.select({ id: contestRounds.id, number: contestRounds.number, isFlyOff: contestRounds.isFlyOff, task: contestRounds.task })
    .from(contestRounds).where(eq(contestRounds.contestId, contestId)).orderBy(asc(contestRounds.isFlyOff), asc(contestRounds.number));
  const entries = await db.select({ id: contestEntries.id, name: contestEntries.pilotName, team: contestEntries.team, pilotClass: contestEntries.pilotClass, withdrawnAt: contestEntries.withdrawnAt })
    .from(contestEntries).where(eq(contestEntries.contestId, contestId)).orderBy(asc(contestEntries.createdAt), asc(contestEntries.id));
  const slots = rounds.length === 0 ? [] : await db.select({
    roundId: groupSlots.roundId, groupNumber: groupSlots.groupNumber, entryId: groupSlots.entryId, paperFlights: groupSlots.paperFlights,
    signedAt: groupSlots.signedAt, penaltyPoints: groupSlots.penaltyPoints, runResultTenths: runLanes.resultTenths, runPenaltyPoints: runLanes.seasonPenaltyPoints, runFlights: sql<unknown>`${runLanes.derived} -> 'flights'`,
  }).from(groupSlots)
    .leftJoin(runLanes, and(eq(runLanes.runId, groupSlots.runId), eq(runLanes.lane, groupSlots.lane)))
    .where(inArray(groupSlots.roundId, rounds.map((r) => r.id)))
    .orderBy(asc(groupSlots.groupNumber));
  const roundIds = rounds.map((r) => r.id);
  const [reflights, disputed, officerPenalties, undecided] = await Promise.all([
    reflightsOfRounds(db, roundIds), openDisputesOfRounds(db, roundIds), officerPenaltiesOfRounds(db, roundIds), undecidedOfRounds(db, roundIds),
  ]);
  return {
    contest: { id: c.id, name: c.name, startsOn: c.startsOn, fieldName: c.fieldName, dropRule: c.dropRule, clubId: c.clubId, publicToken: c.publicToken, flyOffPilots: c.flyOffPilots },
    input: {
      dropRule: c.dropRule,
      halves: c.halves,
      rounds: rounds.map((r) => ({ ...r, task: r.task as TaskDefinition })),
      entries: entries.map((e) => ({ id: e.id, name: e.name, team: e.team, pilotClass: e.pilotClass, withdrawn: e.withdrawnAt !== null })),
      slots: slots.map((s): StandingsSlot => ({
        roundId: s.roundId, groupNumber: s.groupNumber, entryId: s.entryId, runResultTenths: s.runResultTenths ?? null,
        paperFlights: s.paperFlights, signed: s.signedAt !== null, penaltyPoints: s.penaltyPoints, runPenaltyPoints: s.runPenaltyPoints ?? 0,
        officerPenalties: officerPenalties.get(`${s.roundId}/${s.entryId}`) ?? [],
        reflight: reflights.get(`${s.roundId}/${s.entryId}`) ?? null, disputed: disputed.has(`${s.roundId}/${s.entryId}`),
        undecided: undecided.has(`${s.roundId}/${s.entryId}`),
      })),
    },
    flights: slots.map((s) => ({ roundId: s.roundId, groupNumber: s.groupNumber, entryId: s.entryId, runFlights: (s.runFlights as ResultsData["flights"][number]["runFlights"]) ?? null })),
  };
}

/** A round of the contest by number (preliminary, or the fly-off's with `flyOff`), with its task; null when there is none. */
export async function getRound(db: Database, p: { contestId: string; roundNumber: number; flyOff?: boolean }) {
  const [r] = await db.select({ id: contestRounds.id, number: contestRounds.number, task: contestRounds.task }).from(contestRounds)
    .where(and(eq(contestRounds.contestId, p.contestId), eq(contestRounds.number, p.roundNumber), eq(contestRounds.isFlyOff, p.flyOff ?? false)));
  return r ? { ...r, task: r.task as TaskDefinition } : null;
}

/** The round's slots by group, with each pilot's name and what is recorded for them. */
export async function listRoundSlots(db: Database, roundId: string) {
  return db.select({
    entryId: groupSlots.entryId, groupNumber: groupSlots.groupNumber, name: contestEntries.pilotName, paperFlights: groupSlots.paperFlights,
    penaltyPoints: groupSlots.penaltyPoints, signedAt: groupSlots.signedAt, signedFrom: groupSlots.signedFrom, runId: groupSlots.runId,
    lane: groupSlots.lane, runResultTenths: runLanes.resultTenths, recordedAt: groupSlots.recordedAt,
  }).from(groupSlots).innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .leftJoin(runLanes, and(eq(runLanes.runId, groupSlots.runId), eq(runLanes.lane, groupSlots.lane)))
    .where(eq(groupSlots.roundId, roundId)).orderBy(asc(groupSlots.groupNumber), asc(contestEntries.pilotName));
}

export type PaperCard = { entryId: string; flights: number[] | null; penaltyPoints: number; signed: boolean };

/**
 * Saves one group's paper cards in a round: each card's flights (null keeps a linked run's
 * result), penalty and signature, with who and when. "not_in_group" (nothing saved) when a card
 * names a pilot not drawn in that group; every card or none is written.
 */
export async function saveGroupCards(db: Database, p: { roundId: string; groupNumber: number; userId: string; cards: PaperCard[] }): Promise<"saved" | "not_in_group"> {
  return db.transaction(async (tx) => {
    const drawn = await tx.select({ entryId: groupSlots.entryId }).from(groupSlots)
      .where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.groupNumber, p.groupNumber)));
    const ids = new Set(drawn.map((d) => d.entryId));
    if (p.cards.some((c) => !ids.has(c.entryId)) || new Set(p.cards.map((c) => c.entryId)).size !== p.cards.length) return "not_in_group";
    const now = new Date();
    for (const card of p.cards) {
      // a card with flights outranks a linked timed run: the run is kept for the officer's decision (once); the slot is
      // locked first and read as committed (FOR UPDATE), so a run a phone linked meanwhile is kept, not lost
      if (card.flights !== null) {
        await tx.execute(sql`
          with g as (select * from group_slots where round_id = ${p.roundId} and entry_id = ${card.entryId} for update)
          insert into slot_records (slot_id, run_id, lane, recorded_by, recorded_at, signed_at, signed_from)
          select g.id, g.run_id, g.lane, g.recorded_by, g.recorded_at, g.signed_at, g.signed_from from g
          where g.run_id is not null and g.paper_flights is null
            and not exists (select 1 from slot_records r where r.slot_id = g.id and r.outcome is null and r.run_id = g.run_id and r.lane = g.lane)`);
      }
      await tx.update(groupSlots).set({
        paperFlights: card.flights, penaltyPoints: card.penaltyPoints, recordedBy: p.userId, recordedAt: now,
        signedAt: card.signed ? sql`coalesce(${groupSlots.signedAt}, ${now.toISOString()}::timestamptz)` : null,
        signedFrom: card.signed ? sql`coalesce(${groupSlots.signedFrom}, 'paper card')` : null,
      }).where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.groupNumber, p.groupNumber), eq(groupSlots.entryId, card.entryId)));
    }
    return "saved";
  });
}

/** Sets (a new secret) or clears the contest's public results link. */
export async function setPublicToken(db: Database, p: { contestId: string; token: string | null }): Promise<void> {
  await db.update(contests).set({ publicToken: p.token }).where(eq(contests.id, p.contestId));
}

/** The contest a public results link opens; null when the link is unknown or revoked. */
export async function contestIdByPublicToken(db: Database, token: string): Promise<string | null> {
  const [row] = await db.select({ id: contests.id }).from(contests).where(eq(contests.publicToken, token));
  return row?.id ?? null;
}


/**
 * Links a timed run's lane to a pilot's slot in a round (its server result, derived by runResult,
 * becomes the round's result; a paper card entered before and the signature are cleared), or unlinks it (null).
 * "no_slot" when the pilot is not drawn in the round; "no_lane" when the lane is not one
 * listLinkableLanes offers for this contest (club, day, task).
 */
export async function linkRun(db: Database, p: {
  contestId: string; roundId: string; entryId: string; userId: string; link: { runId: string; lane: number } | null;
}): Promise<"linked" | "no_slot" | "no_lane"> {
  return db.transaction(async (tx) => {
    const [slot] = await tx.select({ id: groupSlots.id }).from(groupSlots).where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.entryId, p.entryId)));
    if (!slot) return "no_slot";
    if (p.link) {
      const [c] = await tx.select({ clubId: contests.clubId, day: contests.startsOn }).from(contests).where(eq(contests.id, p.contestId));
      const [round] = await tx.select({ task: contestRounds.task }).from(contestRounds).where(eq(contestRounds.id, p.roundId));
      const lanes = await listLinkableLanes(tx as unknown as Database, { clubId: c!.clubId, day: c!.day, letter: (round!.task as TaskDefinition).letter });
      if (!lanes.some((l) => l.runId === p.link!.runId && l.lane === p.link!.lane)) return "no_lane";
    }
    await tx.update(groupSlots).set({
      runId: p.link?.runId ?? null, lane: p.link?.lane ?? null, paperFlights: null, recordedBy: p.userId, recordedAt: new Date(),
      // another result needs its own signature (F3K.1.2)
      signedAt: null, signedFrom: null,
    }).where(eq(groupSlots.id, slot.id));
    if (p.link) await requestsFromLinkedLane(tx, { roundId: p.roundId, entryId: p.entryId, ...p.link });
    return "linked";
  });
}
