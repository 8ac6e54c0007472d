import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { timekeeperProblem, type TimekeeperChoice } from "@/lib/contests/timekeepers";
import type { RunEntity } from "@/lib/events/entities";
import type { RunEvent } from "@/lib/events/schema";
import type { PulledDuty } from "@/lib/validations/contest-sync";
import type { Database } from "../index";
import { contestEntries, contestReflights, contestRounds, contests, groupSlots, memberships } from "../schema";
import type { Executor } from "./sync-db";

/** Who may keep time at a contest: the club's members and the contest's entered pilots with an account, by name. */
export async function listTimekeeperCandidates(db: Executor, contestId: string): Promise<{ id: string; name: string }[]> {
  const res = await db.execute<{ id: string; name: string }>(sql`
    select u.id::text as id, u.name from users u
    where u.disabled_at is null and (
      u.id in (select m.user_id from memberships m join contests c on c.club_id = m.club_id where c.id = ${contestId})
      or u.id in (select e.pilot_user_id from contest_entries e where e.contest_id = ${contestId} and e.withdrawn_at is null)
    )
    order by u.name, u.id`);
  return res.rows;
}

/** A round's pilots by group with their assigned timekeeper, who assigned them and when. */
export async function listRoundTimekeepers(db: Database, roundId: string) {
  const keeper = sql<string | null>`(select u.name from users u where u.id = ${groupSlots.timekeeperUserId})`;
  const assigner = sql<string | null>`(select u.name from users u where u.id = ${groupSlots.timekeeperAssignedBy})`;
  return db.select({
    entryId: groupSlots.entryId, groupNumber: groupSlots.groupNumber, name: contestEntries.pilotName, pilotUserId: contestEntries.pilotUserId,
    timekeeperUserId: groupSlots.timekeeperUserId, timekeeperName: keeper, assignedByName: assigner, assignedAt: groupSlots.timekeeperAssignedAt,
  }).from(groupSlots).innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .where(eq(groupSlots.roundId, roundId)).orderBy(asc(groupSlots.groupNumber), asc(contestEntries.pilotName));
}

/**
 * Saves one group's timekeepers in a round (each named pilot's timekeeper, or none), with who and
 * when; all or nothing. Returns the problem (nothing saved) from lib/contests/timekeepers.ts
 * timekeeperProblem, or "saved". The group's rows are locked, so two officers saving at once take turns.
 */
export async function saveGroupTimekeepers(db: Database, p: {
  contestId: string; roundId: string; groupNumber: number; userId: string; choices: TimekeeperChoice[];
}): Promise<{ saved: true } | { saved: false; problem: string }> {
  return db.transaction(async (tx) => {
    const group = await tx.select({ entryId: groupSlots.entryId, pilotUserId: contestEntries.pilotUserId, timekeeperUserId: groupSlots.timekeeperUserId })
      .from(groupSlots).innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
      .where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.groupNumber, p.groupNumber))).for("update", { of: groupSlots });
    if (group.length === 0) return { saved: false, problem: "No such group in this round." };
    const eligible = new Set((await listTimekeeperCandidates(tx, p.contestId)).map((c) => c.id));
    const problem = timekeeperProblem(group, eligible, p.choices, group.map((g) => ({ entryId: g.entryId, timekeeperUserId: g.timekeeperUserId })));
    if (problem) return { saved: false, problem };
    const now = new Date();
    for (const c of p.choices) {
      const before = group.find((g) => g.entryId === c.entryId)!;
      if (before.timekeeperUserId === c.timekeeperUserId) continue; // unchanged: keeps who assigned it and when
      await tx.update(groupSlots).set({
        timekeeperUserId: c.timekeeperUserId, timekeeperAssignedBy: p.userId, timekeeperAssignedAt: now,
      }).where(and(eq(groupSlots.roundId, p.roundId), eq(groupSlots.entryId, c.entryId)));
    }
    return { saved: true };
  });
}

/** How long after a contest's day its duties stay on the timekeeper's phone. */
const DUTY_DAYS_AFTER = 2;

/**
 * The contest groups a user keeps time for, with the pilots assigned to them (the phone's lanes), for
 * contests on or after two days ago (a phone syncs ahead of the day; a late sync still has them): the
 * pull's `contestDuties`. At most 1,000 groups. A duty carries the contest's club when the timekeeper
 * is a member (the phone's session then belongs to the club, so the run is among the club's for the
 * officer and on its home page); an entered pilot from elsewhere times without it (a push would refuse it).
 */
export async function dutiesOf(db: Executor, userId: string): Promise<PulledDuty[]> {
  const rows = await db.select({
    contestId: contests.id, clubId: memberships.clubId, contestName: contests.name, fieldName: contests.fieldName, startsOn: contests.startsOn,
    roundId: contestRounds.id, roundNumber: contestRounds.number, isFlyOff: contestRounds.isFlyOff, task: contestRounds.task,
    groupNumber: groupSlots.groupNumber, entryId: groupSlots.entryId, name: contestEntries.pilotName,
  }).from(groupSlots)
    .innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId))
    .innerJoin(contests, eq(contests.id, contestRounds.contestId))
    .innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .leftJoin(memberships, and(eq(memberships.clubId, contests.clubId), eq(memberships.userId, userId)))
    .where(and(
      eq(groupSlots.timekeeperUserId, userId),
      sql`${contests.startsOn} >= current_date - ${DUTY_DAYS_AFTER}::int`,
      sql`${contestEntries.withdrawnAt} is null`,
    ))
    .orderBy(asc(contests.startsOn), asc(contests.id), asc(contestRounds.isFlyOff), asc(contestRounds.number), asc(groupSlots.groupNumber), asc(contestEntries.pilotName))
    .limit(4_000);
  const duties = new Map<string, PulledDuty>();
  for (const r of rows) {
    const key = `${r.roundId}:${r.groupNumber}`;
    const d = duties.get(key) ?? {
      contestId: r.contestId, ...(r.clubId ? { clubId: r.clubId } : {}), contestName: r.contestName, fieldName: r.fieldName, startsOn: r.startsOn,
      roundId: r.roundId, roundNumber: r.roundNumber, flyOff: r.isFlyOff, groupNumber: r.groupNumber, task: r.task as Record<string, unknown>, pilots: [],
    };
    d.pilots.push({ entryId: r.entryId, name: r.name });
    duties.set(key, d);
  }
  return [...duties.values(), ...(await reflightDutiesOf(db, userId))].slice(0, 1_000);
}

/** The re-flights a user times (contest_reflights.timekeeper_user_id), one duty each with its one pilot, for the same days as the groups' duties. */
async function reflightDutiesOf(db: Executor, userId: string): Promise<PulledDuty[]> {
  const rows = await db.select({
    reflightId: contestReflights.id, contestId: contests.id, clubId: memberships.clubId, contestName: contests.name, fieldName: contests.fieldName, startsOn: contests.startsOn,
    roundId: contestRounds.id, roundNumber: contestRounds.number, isFlyOff: contestRounds.isFlyOff, task: contestRounds.task,
    groupNumber: contestReflights.groupNumber, entryId: contestReflights.entryId, name: contestEntries.pilotName,
  }).from(contestReflights)
    .innerJoin(contestRounds, eq(contestRounds.id, contestReflights.roundId))
    .innerJoin(contests, eq(contests.id, contestRounds.contestId))
    .innerJoin(contestEntries, eq(contestEntries.id, contestReflights.entryId))
    .leftJoin(memberships, and(eq(memberships.clubId, contests.clubId), eq(memberships.userId, userId)))
    .where(and(
      eq(contestReflights.timekeeperUserId, userId),
      sql`${contests.startsOn} >= current_date - ${DUTY_DAYS_AFTER}::int`,
      sql`${contestEntries.withdrawnAt} is null`,
    ))
    .orderBy(asc(contests.startsOn), asc(contests.id), asc(contestRounds.isFlyOff), asc(contestRounds.number), asc(contestReflights.groupNumber), asc(contestEntries.pilotName))
    .limit(1_000);
  return rows.map((r) => ({
    contestId: r.contestId, ...(r.clubId ? { clubId: r.clubId } : {}), contestName: r.contestName, fieldName: r.fieldName, startsOn: r.startsOn,
    roundId: r.roundId, roundNumber: r.roundNumber, flyOff: r.isFlyOff, groupNumber: r.groupNumber, reflightId: r.reflightId,
    task: r.task as Record<string, unknown>, pilots: [{ entryId: r.entryId, name: r.name }],
  }));
}

/**
 * Links the lanes of runs just pushed from a timekeeper's duty (RunEntity.contest) to the pilots'
 * slots: only slots whose assigned timekeeper is the pushing account, only lanes the run has, and only
 * when the run's task is the round's. The run's result (run_lanes.result_tenths, derived by
 * lib/results runResult) becomes the slot's official result: a paper card is cleared, and so is an
 * earlier signature (a new result needs its own, F3K.1.2); the record it replaces (a paper card or
 * another run) is kept in slot_records for the officer's decision. A re-flight duty's run goes to its
 * grant instead (linkReflightLane). Called by the push (sync-push-entities.ts).
 */
export async function linkTimedLanes(tx: Executor, userId: string, pushed: readonly RunEntity[]): Promise<number> {
  let linked = 0;
  const withContest = pushed.filter((r) => r.contest);
  if (withContest.length === 0) return 0;
  const rounds = await tx.select({ id: contestRounds.id, task: contestRounds.task }).from(contestRounds)
    .where(inArray(contestRounds.id, [...new Set(withContest.map((r) => r.contest!.roundId))]));
  const letterOf = new Map(rounds.map((r) => [r.id, (r.task as { letter?: string | null }).letter ?? null]));
  const now = new Date();
  for (const run of withContest) {
    const { roundId, slots, reflightId } = run.contest!;
    if (!letterOf.has(roundId) || letterOf.get(roundId) !== ((run.task as { letter?: string | null }).letter ?? null)) continue;
    const lanes = new Set(run.lanes.map((l) => l.lane));
    if (reflightId) {
      linked += await linkReflightLane(tx, userId, { runId: run.id, roundId, reflightId, slots: slots.filter((s) => lanes.has(s.lane)) }, now);
      continue;
    }
    for (const s of slots) {
      if (!lanes.has(s.lane)) continue;
      // the record this run replaces (a paper card, or another run) is kept for the officer's decision; the slot is
      // locked first and read as committed by whoever held it (FOR UPDATE), so a card saved meanwhile is kept, not lost
      await tx.execute(sql`
        with g as (select * from group_slots where round_id = ${roundId} and entry_id = ${s.entryId} and timekeeper_user_id = ${userId} for update)
        insert into slot_records (slot_id, paper_flights, run_id, lane, recorded_by, recorded_at, signed_at, signed_from)
        select g.id, g.paper_flights, g.run_id, g.lane, g.recorded_by, g.recorded_at, g.signed_at, g.signed_from from g
        where g.paper_flights is not null or (g.run_id is not null and (g.run_id, g.lane) is distinct from (${run.id}::uuid, ${s.lane}::smallint))`);
      const done = await tx.update(groupSlots).set({
        runId: run.id, lane: s.lane, paperFlights: null, recordedBy: userId, recordedAt: now, signedAt: null, signedFrom: null,
      }).where(and(eq(groupSlots.roundId, roundId), eq(groupSlots.entryId, s.entryId), eq(groupSlots.timekeeperUserId, userId))).returning({ id: groupSlots.id });
      linked += done.length;
    }
  }
  return linked;
}

/**
 * A re-flight duty's run (RunEntity.contest.reflightId): its lane becomes the re-flight grant's result
 * (not the slot's), only when the pushing account is the grant's timekeeper and the lane's entry is the
 * grant's pilot in that round. A paper card and an earlier signature on the grant are cleared (a new
 * result needs its own signature, F3K.1.2) and the record replaced is kept in slot_records (reflight_id)
 * for the officer's decision; which result stands is lib/scoring/reflight.ts, as for any
 * re-flight result.
 */
async function linkReflightLane(tx: Executor, userId: string, p: { runId: string; roundId: string; reflightId: string; slots: { lane: number; entryId: string }[] }, now: Date): Promise<number> {
  const slot = p.slots[0];
  if (!slot) return 0;
  // the record this run replaces (a paper card, or another run) is kept for the officer's decision, as for a slot
  // (the grant locked first and read as committed: a card recorded meanwhile is kept)
  await tx.execute(sql`
    with g as (select * from contest_reflights
      where id = ${p.reflightId} and round_id = ${p.roundId} and entry_id = ${slot.entryId} and timekeeper_user_id = ${userId} for update)
    insert into slot_records (reflight_id, paper_flights, run_id, lane, recorded_by, recorded_at, signed_at, signed_from)
    select g.id, g.paper_flights, g.run_id, g.lane, g.recorded_by, g.recorded_at, g.signed_at, g.signed_from from g
    where g.paper_flights is not null or (g.run_id is not null and (g.run_id, g.lane) is distinct from (${p.runId}::uuid, ${slot.lane}::smallint))`);
  const done = await tx.update(contestReflights).set({
    runId: p.runId, lane: slot.lane, paperFlights: null, recordedBy: userId, recordedAt: now, signedAt: null, signedFrom: null,
  }).where(and(
    eq(contestReflights.id, p.reflightId), eq(contestReflights.roundId, p.roundId), eq(contestReflights.entryId, slot.entryId),
    eq(contestReflights.timekeeperUserId, userId),
    // the same lane pushed again keeps its signature
    sql`(${contestReflights.runId}, ${contestReflights.lane}) is distinct from (${p.runId}::uuid, ${slot.lane}::smallint)`,
  )).returning({ id: contestReflights.id });
  return done.length;
}

/**
 * Pilot and timekeeper signed lanes on the timekeeper's phone ("signed" events just pushed): each
 * lane linked to a contest slot whose timekeeper is the pushing account gets its signature (F3K.1.2),
 * at the phone's time of signing (its clock corrected by the event's offset estimate, when it has one),
 * with who signed: "on the phone: pilot <lane's pilot>, timekeeper <account's name>". A slot signed
 * already keeps its first signature. An undo on the phone ("void" naming a "signed" event) takes the
 * phone's signature off the slot again (a paper card's signature is the officer's, not the phone's).
 * Events are applied in the order pushed (sign, undo, sign again ends signed). A re-flight the phone timed
 * (contest_reflights with the run's lane, the pushing account its timekeeper) is signed and unsigned the
 * same way. Called by the push (sync-push.ts).
 */
export async function signLanes(tx: Executor, userId: string, events: readonly RunEvent[]): Promise<number> {
  let changed = 0;
  // only undos (the usual case: a flight undone): one statement for them all
  if (!events.some((e) => e.body.kind === "signed")) return unsign(tx, userId, events.flatMap((e) => (e.body.kind === "void" ? [e.body.targetId] : [])));
  for (const e of events) {
    if (e.body.kind === "signed") {
      const at = new Date(e.stamp.wallMs + (e.stamp.offset?.thetaMs ?? 0));
      const res = await tx.execute(sql`
        update group_slots g set
          signed_at = coalesce(g.signed_at, ${at.toISOString()}::timestamptz),
          signed_from = coalesce(g.signed_from, 'on the phone: pilot ' || l.pilot_name || ', timekeeper ' || u.name)
        from run_lanes l, users u
        where g.run_id = ${e.runId} and g.lane = ${e.body.lane} and g.timekeeper_user_id = ${userId}
          and l.run_id = g.run_id and l.lane = g.lane and u.id = ${userId}`);
      // a re-flight the phone timed (its lane is the grant's result): signed the same way
      const reflown = await tx.execute(sql`
        update contest_reflights g set
          signed_at = coalesce(g.signed_at, ${at.toISOString()}::timestamptz),
          signed_from = coalesce(g.signed_from, 'on the phone: pilot ' || l.pilot_name || ', timekeeper ' || u.name)
        from run_lanes l, users u
        where g.run_id = ${e.runId} and g.lane = ${e.body.lane} and g.timekeeper_user_id = ${userId}
          and l.run_id = g.run_id and l.lane = g.lane and u.id = ${userId}`);
      changed += (res.rowCount ?? 0) + (reflown.rowCount ?? 0);
    } else if (e.body.kind === "void") {
      changed += await unsign(tx, userId, [e.body.targetId]);
    }
  }
  return changed;
}

/** Takes the phone's signature off the slots whose "signed" events these undos name (the pushing timekeeper's slots only). */
async function unsign(tx: Executor, userId: string, targetIds: readonly string[]): Promise<number> {
  if (targetIds.length === 0) return 0;
  const res = await tx.execute(sql`
    update group_slots g set signed_at = null, signed_from = null
    from events t
    where t.id in (${sql.join(targetIds.map((id) => sql`${id}::uuid`), sql`, `)}) and t.body ->> 'kind' = 'signed'
      and g.run_id = t.run_id and g.lane = (t.body ->> 'lane')::int and g.timekeeper_user_id = ${userId}
      and g.signed_from like 'on the phone:%'`);
  const reflown = await tx.execute(sql`
    update contest_reflights g set signed_at = null, signed_from = null
    from events t
    where t.id in (${sql.join(targetIds.map((id) => sql`${id}::uuid`), sql`, `)}) and t.body ->> 'kind' = 'signed'
      and g.run_id = t.run_id and g.lane = (t.body ->> 'lane')::int and g.timekeeper_user_id = ${userId}
      and g.signed_from like 'on the phone:%'`);
  return (res.rowCount ?? 0) + (reflown.rowCount ?? 0);
}

/** Every signed result of the contest: round, group, pilot, when and how it was signed (the results page lists them). */
export async function listSignatures(db: Database, contestId: string) {
  return db.select({
    roundNumber: contestRounds.number, isFlyOff: contestRounds.isFlyOff, groupNumber: groupSlots.groupNumber, name: contestEntries.pilotName,
    signedAt: groupSlots.signedAt, signedFrom: groupSlots.signedFrom,
  }).from(groupSlots)
    .innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId))
    .innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .where(and(eq(contestRounds.contestId, contestId), sql`${groupSlots.signedAt} is not null`))
    .orderBy(asc(contestRounds.isFlyOff), asc(contestRounds.number), asc(groupSlots.groupNumber), asc(contestEntries.pilotName));
}
