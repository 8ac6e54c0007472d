import "server-only";
import { linkTimedLanes } from "./contest-timekeepers";
import { inArray, sql, type SQL } from "drizzle-orm";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import { pilotRefusal, runSessionRefusal } from "@/lib/sync/authorise";
import { taskDefinitionSchema } from "@/lib/tasks";
import type { Ack } from "@/lib/validations/sync";
import { EPOCH_MS_MAX } from "@/lib/validations/bounds";
import { MAX_RUNS_PER_DAY } from "@/lib/validations/sync-push";
import { fieldSessions, runLanes, runs } from "../schema";
import { isDateMs, isUuid, lockAccountRuns, type Tx } from "./sync-db";

/** What every part of one push shares: the transaction, who pushes, and the acks so far. */
export type PushContext = { tx: Tx; userId: string; deviceId: string; clubIds: ReadonlySet<string>; acks: Ack[] };

export const reject = (ctx: PushContext, id: string, reason: string) => ctx.acks.push({ id, status: "rejected", reason });

/** Apply pushed sessions; returns the ids the server now holds for this user (applied or duplicate). */
export async function applySessions(ctx: PushContext, sessions: readonly SessionEntity[]): Promise<Set<string>> {
  if (sessions.length === 0) return new Set();
  const owners = (await ctx.tx.execute<SessionOwnerRow>(sessionOwnersSql(ctx.tx, sessions))).rows;
  const { ok, insert } = decideSessions(ctx, sessions, owners);
  if (insert) await ctx.tx.execute(insert);
  return ok;
}

type SessionOwnerRow = { id: string; owner_id: string };

/** The pushed sessions already stored and their owners (rows `{ id, owner_id }`): what decideSessions reads. */
export const sessionOwnersSql = (tx: Tx, sessions: readonly SessionEntity[]): SQL =>
  tx.select({ id: fieldSessions.id, ownerId: fieldSessions.ownerId }).from(fieldSessions).where(inArray(fieldSessions.id, sessions.map((s) => s.id))).getSQL();

/**
 * Each pushed session checked against the stored owners (sessionOwnersSql's rows), its ack pushed; returns the ids
 * the server holds for this user once `insert` (null when nothing is new) has run.
 */
export function decideSessions(ctx: PushContext, sessions: readonly SessionEntity[], rows: readonly SessionOwnerRow[]): { ok: Set<string>; insert: SQL | null } {
  const ok = new Set<string>();
  const owners = new Map(rows.map((r) => [r.id, r.owner_id]));
  const fresh: (typeof fieldSessions.$inferInsert)[] = [];
  for (const s of sessions) {
    const owner = owners.get(s.id);
    if (ok.has(s.id) || owner === ctx.userId) {
      ctx.acks.push({ id: s.id, status: "duplicate" });
      ok.add(s.id);
    } else if (owner !== undefined) reject(ctx, s.id, "This session id is already used by someone else.");
    else if (s.ownerId !== ctx.userId) reject(ctx, s.id, "A session can only be created by its owner.");
    else if (s.clubId !== undefined && !(isUuid(s.clubId) && ctx.clubIds.has(s.clubId))) reject(ctx, s.id, "You are not a member of that club.");
    else if (!isDateMs(s.startedAtWallMs)) reject(ctx, s.id, "The session's start time is not a valid date.");
    else {
      fresh.push({
        id: s.id, ownerId: s.ownerId, clubId: s.clubId ?? null, fieldName: s.fieldName,
        latitude: s.position?.lat ?? null, longitude: s.position?.lon ?? null,
        conditions: s.conditions, startedAt: new Date(s.startedAtWallMs),
      });
      ctx.acks.push({ id: s.id, status: "applied" });
      ok.add(s.id);
    }
  }
  return { ok, insert: fresh.length > 0 ? ctx.tx.insert(fieldSessions).values(fresh).onConflictDoNothing().getSQL() : null };
}

/** Apply pushed runs (with their lanes); returns the ids of runs newly created. */
export async function applyRuns(ctx: PushContext, items: readonly RunEntity[]): Promise<string[]> {
  if (items.length === 0) return [];
  const { tx } = ctx;
  await lockAccountRuns(tx, ctx.userId); // the runs-per-day count below holds until this push commits
  const facts = readRunFacts((await tx.execute<RunFactsRow>(runFactsSql(ctx, items))).rows[0]!);
  const { insert, newRuns } = decideRuns(ctx, items, facts);
  if (insert) {
    await tx.execute(insert);
    await linkContestRuns(ctx, items, newRuns);
  }
  return newRuns;
}

/** A contest timekeeper's window: its lanes become the pilots' official results (after the runs' insert). */
export async function linkContestRuns(ctx: PushContext, items: readonly RunEntity[], newRuns: readonly string[]): Promise<void> {
  const fresh = new Set(newRuns);
  if (items.some((r) => r.contest)) await linkTimedLanes(ctx.tx, ctx.userId, items.filter((r) => r.contest && fresh.has(r.id)));
}

/**
 * Each pushed run checked against runFacts' facts, its ack pushed; returns the runs' and their lanes' insert (ONE
 * statement; null when no run is new) and the ids of the runs it creates.
 */
export function decideRuns(ctx: PushContext, items: readonly RunEntity[], facts: RunFacts): { insert: SQL | null; newRuns: string[] } {
  const { tx } = ctx;
  const { creators, sessionsById, pilots, perDay, planItems } = facts;
  const freshRuns: (typeof runs.$inferInsert)[] = [];
  const freshLanes: (typeof runLanes.$inferInsert)[] = [];
  const seen = new Set<string>();
  for (const r of items) {
    const creator = creators.get(r.id);
    if (seen.has(r.id) || creator === ctx.userId) {
      ctx.acks.push({ id: r.id, status: "duplicate" });
      continue;
    }
    if (creator !== undefined) {
      reject(ctx, r.id, "This run id is already used by someone else.");
      continue;
    }
    const task = taskDefinitionSchema.safeParse(r.task);
    const refusal =
      (!task.success ? `The task definition is not valid: ${task.error.issues[0]?.message ?? "?"}` : null) ??
      (!isDateMs(r.createdAtWallMs) ? "The run's creation time is not a valid date." : null) ??
      runSessionRefusal(ctx.userId, sessionsById.get(r.sessionId) ?? null) ??
      ((perDay.get(utcDay(r.createdAtWallMs)) ?? 0) >= MAX_RUNS_PER_DAY
        ? `You already have ${MAX_RUNS_PER_DAY} runs on that day, the most one account may record per day.`
        : null) ??
      r.lanes
        .map((l) => (l.pilotUserId === undefined ? null : pilotRefusal(ctx.userId, l.lane, l.pilotUserId, pilots.sharesClub.has(l.pilotUserId), pilots.exists.has(l.pilotUserId))))
        .find((x) => x !== null) ??
      null;
    if (refusal || !task.success) {
      reject(ctx, r.id, refusal ?? "invalid");
      continue;
    }
    seen.add(r.id);
    perDay.set(utcDay(r.createdAtWallMs), (perDay.get(utcDay(r.createdAtWallMs)) ?? 0) + 1);
    freshRuns.push({
      // only the parsed task is stored: fields the engine does not know are dropped
      id: r.id, sessionId: r.sessionId, createdBy: ctx.userId, task: task.data, taskCode: task.data.letter ?? "custom",
      edition: task.data.edition, createdAt: new Date(r.createdAtWallMs),
      // a plan link counts only for a plan assigned to this pilot, and an item it has; otherwise it is left off
      ...(r.plan && r.plan.item < (planItems.get(r.plan.id) ?? 0) ? { planId: r.plan.id, planItem: r.plan.item } : {}),
    });
    for (const l of r.lanes) freshLanes.push({ runId: r.id, lane: l.lane, pilotUserId: l.pilotUserId ?? null, pilotName: l.pilotName });
    ctx.acks.push({ id: r.id, status: "applied" });
  }
  if (freshRuns.length === 0) return { insert: null, newRuns: [] };
  // the runs and their lanes in one statement (one round trip; the lanes' foreign keys are checked at its end)
  const runsInsert = tx.insert(runs).values(freshRuns).onConflictDoNothing().getSQL();
  const insert = freshLanes.length === 0 ? runsInsert : sql`with fresh_runs as (${runsInsert}) ${tx.insert(runLanes).values(freshLanes).onConflictDoNothing().getSQL()}`;
  return { insert, newRuns: freshRuns.map((r) => r.id!) };
}

const DAY_MS = 86_400_000;
const utcDay = (ms: number) => Math.floor(ms / DAY_MS);

/**
 * What the checks of pushed runs read, in ONE statement (one round trip; after lockAccountRuns, so
 * the runs-per-day counts see every run a concurrent push of this account committed): the pushed ids
 * already stored and by whom, their sessions' owners, which named pilots exist and which share a club
 * with the pushing user, how many runs the user already has on each UTC day the runs fall on, and the
 * number of items of each named practice plan that is the user's own.
 */
export function runFactsSql(ctx: PushContext, items: readonly RunEntity[]): SQL {
  const uuids = (list: Iterable<string>) => sql`${sql.param([...new Set(list)])}::uuid[]`;
  const pilotIds = [...new Set(items.flatMap((r) => r.lanes.flatMap((l) => (l.pilotUserId && isUuid(l.pilotUserId) ? [l.pilotUserId] : []))))];
  const planIds = items.flatMap((r) => (r.plan ? [r.plan.id] : []));
  const days = items.map((r) => utcDay(r.createdAtWallMs));
  // the last day may end past what the schema lets a date be (EPOCH_MS_MAX): clamp
  const [from, to] = [Math.min(...days) * DAY_MS, Math.min((Math.max(...days) + 1) * DAY_MS, EPOCH_MS_MAX)];
  return sql`select
    (select coalesce(json_agg(json_build_array(id, created_by)), '[]') from runs where id = any(${uuids(items.map((r) => r.id))})) as runs,
    (select coalesce(json_agg(json_build_array(id, owner_id)), '[]') from field_sessions where id = any(${uuids(items.map((r) => r.sessionId))})) as sessions,
    (select coalesce(json_agg(id), '[]') from users where id = any(${uuids(pilotIds)})) as pilots,
    (select coalesce(json_agg(distinct user_id), '[]') from memberships where user_id = any(${uuids(pilotIds)}) and club_id = any(${uuids(ctx.clubIds)})) as mates,
    (select coalesce(json_agg(json_build_array(day, n)), '[]') from (
      select floor(extract(epoch from created_at) / 86400)::int as day, count(*)::int as n from runs
      where created_by = ${ctx.userId} and created_at >= ${new Date(from).toISOString()}::timestamptz and created_at <= ${new Date(to).toISOString()}::timestamptz
      group by 1) d) as days,
    (select coalesce(json_agg(json_build_array(id, jsonb_array_length(items))), '[]') from practice_plans
      where pilot_id = ${ctx.userId} and id = any(${uuids(planIds)})) as plans`;
}

type RunFactsRow = { runs: [string, string][]; sessions: [string, string][]; pilots: string[]; mates: string[]; days: [number, number][]; plans: [string, number][] };
export type RunFacts = ReturnType<typeof readRunFacts>;

/** runFactsSql's row as the checks read it. */
export function readRunFacts(row: RunFactsRow) {
  return {
    creators: new Map(row.runs),
    sessionsById: new Map(row.sessions.map(([id, ownerId]) => [id, { id, ownerId }])),
    pilots: { exists: new Set(row.pilots), sharesClub: new Set(row.mates) },
    perDay: new Map(row.days),
    planItems: new Map(row.plans),
  };
}
