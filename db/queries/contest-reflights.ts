import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { StandingsReflight } from "@/lib/contests/standings";
import type { ReflightCause, ReflightPlacement } from "@/lib/events/schema";
import type { TaskDefinition } from "@/lib/tasks/definition";
import type { Database } from "../index";
import { contestEntries, contestReflights, contestRounds, contests, groupSlots, runLanes, users } from "../schema";
import { listLinkableLanes } from "./contest-lanes";
import { listTimekeeperCandidates } from "./contest-timekeepers";
import { reflightTimekeeperProblem } from "@/lib/contests/timekeepers";
import { alias } from "drizzle-orm/pg-core";

/**
 * Grants a pilot drawn in the round a re-flight (F3K.9.6, F3K.4.2), with who and when. With the
 * original group it is flown in the pilot's own group (the group number given is ignored); in a later
 * group it must be a group of the round flying after the pilot's ("bad_group" otherwise). "no_slot"
 * when the pilot is not drawn in the round; "granted_already" when they have one in this round.
 */
export async function grantReflight(db: Database, p: {
  roundId: string; entryId: string; userId: string; cause: ReflightCause; placement: ReflightPlacement; entitled: boolean; groupNumber: number; reason: string | null;
}): Promise<"granted" | "no_slot" | "bad_group" | "granted_already"> {
  return db.transaction(async (tx) => {
    const groups = await tx.selectDistinct({ groupNumber: groupSlots.groupNumber }).from(groupSlots).where(eq(groupSlots.roundId, p.roundId));
    const [slot] = await tx.select({ groupNumber: groupSlots.groupNumber }).from(groupSlots).where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.entryId, p.entryId)));
    if (!slot) return "no_slot";
    const groupNumber = p.placement === "original-group" ? slot.groupNumber : p.groupNumber;
    if (p.placement === "later-group" && !(groupNumber > slot.groupNumber && groups.some((g) => g.groupNumber === groupNumber))) return "bad_group";
    const done = await tx.insert(contestReflights).values({
      roundId: p.roundId, entryId: p.entryId, cause: p.cause, placement: p.placement, entitled: p.entitled, groupNumber,
      reason: p.reason, grantedBy: p.userId,
    }).onConflictDoNothing().returning({ id: contestReflights.id });
    return done.length > 0 ? "granted" : "granted_already";
  });
}

/**
 * Records a granted re-flight's result: a paper card's flight times, or a timed run's lane (one that
 * listLinkableLanes offers for this contest), or neither (cleared); and its signature (F3K.1.2).
 * A new link or card needs its own signature: a signature is kept only when `signed` says so. A card
 * with flights over a linked run keeps the run in slot_records for the officer's decision (as
 * saveGroupCards does for a slot); an officer's own link is itself a decision and keeps nothing.
 */
export async function recordReflight(db: Database, p: {
  contestId: string; roundId: string; entryId: string; userId: string; flights: number[] | null; link: { runId: string; lane: number } | null; signed: boolean;
}): Promise<"recorded" | "not_granted" | "no_lane"> {
  return db.transaction(async (tx) => {
    const [r] = await tx.select({ id: contestReflights.id }).from(contestReflights).where(and(eq(contestReflights.roundId, p.roundId), eq(contestReflights.entryId, p.entryId)));
    if (!r) return "not_granted";
    if (p.link) {
      const [c] = await tx.select({ clubId: contests.clubId, day: contests.startsOn }).from(contests).where(eq(contests.id, p.contestId));
      const [round] = await tx.select({ task: contestRounds.task }).from(contestRounds).where(eq(contestRounds.id, p.roundId));
      const lanes = await listLinkableLanes(tx as unknown as Database, { clubId: c!.clubId, day: c!.day, letter: (round!.task as TaskDefinition).letter });
      if (!lanes.some((l) => l.runId === p.link!.runId && l.lane === p.link!.lane)) return "no_lane";
    }
    // a card with flights outranks a linked timed run (a timekeeper's phone run): the run is kept for the officer's decision (once)
    // (the grant locked first and read as committed: a run a phone linked meanwhile is kept)
    if (p.flights !== null) {
      await tx.execute(sql`
        with g as (select * from contest_reflights where id = ${r.id} for update)
        insert into slot_records (reflight_id, run_id, lane, recorded_by, recorded_at, signed_at, signed_from)
        select g.id, g.run_id, g.lane, g.recorded_by, g.recorded_at, g.signed_at, g.signed_from from g
        where g.run_id is not null and g.paper_flights is null
          and not exists (select 1 from slot_records k where k.reflight_id = g.id and k.outcome is null and k.run_id = g.run_id and k.lane = g.lane)`);
    }
    const now = new Date();
    await tx.update(contestReflights).set({
      paperFlights: p.flights, runId: p.link?.runId ?? null, lane: p.link?.lane ?? null, recordedBy: p.userId, recordedAt: now,
      signedAt: p.signed ? sql`coalesce(${contestReflights.signedAt}, ${now.toISOString()}::timestamptz)` : null,
      signedFrom: p.signed ? sql`coalesce(${contestReflights.signedFrom}, 'marked by an officer')` : null,
    }).where(eq(contestReflights.id, r.id));
    return "recorded";
  });
}

/**
 * Names (or with null removes) the timekeeper whose phone times a granted re-flight, with who and when:
 * eligible and not flying in the group the re-flight is flown in (lib/contests/timekeepers.ts
 * reflightTimekeeperProblem). "not_granted" when the pilot has no re-flight in the round. The grant's
 * row is locked, so two officers saving at once take turns. The timekeeper's next pull carries the duty.
 */
export async function setReflightTimekeeper(db: Database, p: { contestId: string; roundId: string; entryId: string; userId: string; timekeeperUserId: string | null }):
  Promise<{ saved: true } | { saved: false; problem: string } | "not_granted"> {
  return db.transaction(async (tx) => {
    const [grant] = await tx.select({ id: contestReflights.id, groupNumber: contestReflights.groupNumber, timekeeperUserId: contestReflights.timekeeperUserId })
      .from(contestReflights).where(and(eq(contestReflights.roundId, p.roundId), eq(contestReflights.entryId, p.entryId))).for("update");
    if (!grant) return "not_granted";
    if (p.timekeeperUserId !== null) {
      const inGroup = await tx.select({ pilotUserId: contestEntries.pilotUserId }).from(groupSlots).innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
        .where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.groupNumber, grant.groupNumber)));
      const reflying = await tx.select({ pilotUserId: contestEntries.pilotUserId }).from(contestReflights).innerJoin(contestEntries, eq(contestEntries.id, contestReflights.entryId))
        .where(and(eq(contestReflights.roundId, p.roundId), eq(contestReflights.groupNumber, grant.groupNumber)));
      const flying = new Set([...inGroup, ...reflying].flatMap((r) => (r.pilotUserId ? [r.pilotUserId] : [])));
      const eligible = new Set((await listTimekeeperCandidates(tx, p.contestId)).map((c) => c.id));
      const problem = reflightTimekeeperProblem(p.timekeeperUserId, eligible, flying);
      if (problem) return { saved: false, problem };
    }
    if (grant.timekeeperUserId !== p.timekeeperUserId) {
      await tx.update(contestReflights).set({
        timekeeperUserId: p.timekeeperUserId, timekeeperAssignedBy: p.timekeeperUserId === null ? null : p.userId, timekeeperAssignedAt: p.timekeeperUserId === null ? null : new Date(),
      }).where(eq(contestReflights.id, grant.id));
    }
    return { saved: true };
  });
}

const keeper = alias(users, "reflight_keeper");

/** The round's re-flights with the pilot, who granted it and when, its timekeeper, and what is recorded (the round page lists them). */
export async function listRoundReflights(db: Database, roundId: string) {
  return db.select({
    id: contestReflights.id, timekeeperUserId: contestReflights.timekeeperUserId, timekeeperName: keeper.name, timekeeperAssignedAt: contestReflights.timekeeperAssignedAt,
    signedFrom: contestReflights.signedFrom,
    entryId: contestReflights.entryId, name: contestEntries.pilotName, cause: contestReflights.cause, placement: contestReflights.placement,
    entitled: contestReflights.entitled, groupNumber: contestReflights.groupNumber, reason: contestReflights.reason,
    grantedBy: users.name, grantedAt: contestReflights.grantedAt, paperFlights: contestReflights.paperFlights,
    runId: contestReflights.runId, lane: contestReflights.lane, runResultTenths: runLanes.resultTenths,
    recordedAt: contestReflights.recordedAt, signedAt: contestReflights.signedAt,
  }).from(contestReflights)
    .innerJoin(contestEntries, eq(contestEntries.id, contestReflights.entryId))
    .leftJoin(users, eq(users.id, contestReflights.grantedBy))
    .leftJoin(keeper, eq(keeper.id, contestReflights.timekeeperUserId))
    .leftJoin(runLanes, and(eq(runLanes.runId, contestReflights.runId), eq(runLanes.lane, contestReflights.lane)))
    .where(eq(contestReflights.roundId, roundId)).orderBy(asc(contestReflights.grantedAt), asc(contestEntries.pilotName));
}

/** Every re-flight of these rounds as the standings read it, by round and entry. */
export async function reflightsOfRounds(db: Database, roundIds: readonly string[]): Promise<Map<string, StandingsReflight>> {
  if (roundIds.length === 0) return new Map();
  const rows = await db.select({
    roundId: contestReflights.roundId, entryId: contestReflights.entryId, placement: contestReflights.placement, entitled: contestReflights.entitled,
    groupNumber: contestReflights.groupNumber, paperFlights: contestReflights.paperFlights, runResultTenths: runLanes.resultTenths, runPenaltyPoints: runLanes.seasonPenaltyPoints, signedAt: contestReflights.signedAt,
  }).from(contestReflights)
    .leftJoin(runLanes, and(eq(runLanes.runId, contestReflights.runId), eq(runLanes.lane, contestReflights.lane)))
    .where(inArray(contestReflights.roundId, [...roundIds]));
  return new Map(rows.map((r) => [`${r.roundId}/${r.entryId}`, {
    placement: r.placement, entitled: r.entitled, groupNumber: r.groupNumber, paperFlights: r.paperFlights,
    runResultTenths: r.runResultTenths ?? null, runPenaltyPoints: r.runPenaltyPoints ?? 0, signed: r.signedAt !== null,
  }]));
}

/** Every re-flight of the contest with who granted it and when (the results page lists them). */
export async function listContestReflights(db: Database, contestId: string) {
  return db.select({
    roundNumber: contestRounds.number, isFlyOff: contestRounds.isFlyOff, name: contestEntries.pilotName, cause: contestReflights.cause,
    placement: contestReflights.placement, entitled: contestReflights.entitled, groupNumber: contestReflights.groupNumber, reason: contestReflights.reason,
    grantedBy: users.name, grantedAt: contestReflights.grantedAt,
  }).from(contestReflights)
    .innerJoin(contestRounds, eq(contestRounds.id, contestReflights.roundId))
    .innerJoin(contestEntries, eq(contestEntries.id, contestReflights.entryId))
    .leftJoin(users, eq(users.id, contestReflights.grantedBy))
    .where(eq(contestRounds.contestId, contestId))
    .orderBy(asc(contestRounds.isFlyOff), asc(contestRounds.number), asc(contestReflights.grantedAt));
}
