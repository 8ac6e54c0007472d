import "server-only";
import { ownPlanItems } from "./coach/plans";
import { linkTimedLanes } from "./contest-timekeepers";
import { and, eq, gte, inArray, lte, sql } from "drizzle-orm";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import { pilotRefusal, runSessionRefusal } from "@/lib/sync/authorise";
import { taskDefinitionSchema } from "@/lib/tasks";
import type { Ack } from "@/lib/validations/sync";
import { EPOCH_MS_MAX } from "@/lib/validations/bounds";
import { MAX_RUNS_PER_DAY } from "@/lib/validations/sync-push";
import { fieldSessions, memberships, runLanes, runs, users } from "../schema";
import { isDateMs, isUuid, lockAccountRuns, type Tx } from "./sync-db";

/** What every part of one push shares: the transaction, who pushes, and the acks so far. */
export type PushContext = { tx: Tx; userId: string; deviceId: string; clubIds: ReadonlySet<string>; acks: Ack[] };

export const reject = (ctx: PushContext, id: string, reason: string) => ctx.acks.push({ id, status: "rejected", reason });

/** Apply pushed sessions; returns the ids the server now holds for this user (applied or duplicate). */
export async function applySessions(ctx: PushContext, sessions: readonly SessionEntity[]): Promise<Set<string>> {
  const ok = new Set<string>();
  if (sessions.length === 0) return ok;
  const existing = await ctx.tx
    .select({ id: fieldSessions.id, ownerId: fieldSessions.ownerId })
    .from(fieldSessions)
    .where(inArray(fieldSessions.id, sessions.map((s) => s.id)));
  const owners = new Map(existing.map((r) => [r.id, r.ownerId]));
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
  if (fresh.length > 0) await ctx.tx.insert(fieldSessions).values(fresh).onConflictDoNothing();
  return ok;
}

/** Apply pushed runs (with their lanes); returns the ids of runs newly created. */
export async function applyRuns(ctx: PushContext, items: readonly RunEntity[]): Promise<string[]> {
  if (items.length === 0) return [];
  const { tx } = ctx;
  await lockAccountRuns(tx, ctx.userId); // the runs-per-day count below holds until this push commits
  const sessionIds = [...new Set(items.map((r) => r.sessionId))];
  const existing = await tx.select({ id: runs.id, createdBy: runs.createdBy }).from(runs).where(inArray(runs.id, items.map((r) => r.id)));
  const sessionRows = await tx
    .select({ id: fieldSessions.id, ownerId: fieldSessions.ownerId })
    .from(fieldSessions)
    .where(inArray(fieldSessions.id, sessionIds));
  const creators = new Map(existing.map((r) => [r.id, r.createdBy]));
  const sessionsById = new Map(sessionRows.map((s) => [s.id, s]));
  const pilots = await pilotFacts(ctx, items);
  const perDay = await runsPerDay(ctx, items);
  const planItems = await ownPlanItems(tx, ctx.userId, [...new Set(items.flatMap((r) => (r.plan ? [r.plan.id] : [])))]);
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
  if (freshRuns.length > 0) {
    await tx.insert(runs).values(freshRuns).onConflictDoNothing();
    await tx.insert(runLanes).values(freshLanes).onConflictDoNothing();
    // a contest timekeeper's window: its lanes become the pilots' official results
    if (items.some((r) => r.contest)) await linkTimedLanes(tx, ctx.userId, items.filter((r) => r.contest && seen.has(r.id)));
  }
  return freshRuns.map((r) => r.id!);
}

const DAY_MS = 86_400_000;
const utcDay = (ms: number) => Math.floor(ms / DAY_MS);

/** How many runs the pushing user already has on each UTC day the pushed runs fall on. */
async function runsPerDay(ctx: PushContext, items: readonly RunEntity[]): Promise<Map<number, number>> {
  const days = items.map((r) => utcDay(r.createdAtWallMs));
  // the last day may end past what the schema lets a date be (EPOCH_MS_MAX): clamp
  const [from, to] = [Math.min(...days) * DAY_MS, Math.min((Math.max(...days) + 1) * DAY_MS, EPOCH_MS_MAX)];
  const rows = await ctx.tx
    .select({ day: sql<number>`floor(extract(epoch from ${runs.createdAt}) / 86400)::int`, n: sql<number>`count(*)::int` })
    .from(runs)
    .where(and(eq(runs.createdBy, ctx.userId), gte(runs.createdAt, new Date(from)), lte(runs.createdAt, new Date(to))))
    .groupBy(sql`1`);
  return new Map(rows.map((r) => [Number(r.day), Number(r.n)]));
}

/** Which named pilots exist, and which share a club with the pushing user. */
async function pilotFacts(ctx: PushContext, items: readonly RunEntity[]) {
  const ids = [...new Set(items.flatMap((r) => r.lanes.flatMap((l) => (l.pilotUserId && isUuid(l.pilotUserId) ? [l.pilotUserId] : []))))];
  if (ids.length === 0) return { exists: new Set<string>(), sharesClub: new Set<string>() };
  const found = await ctx.tx.select({ id: users.id }).from(users).where(inArray(users.id, ids));
  const mates =
    ctx.clubIds.size === 0
      ? []
      : await ctx.tx
          .select({ id: memberships.userId })
          .from(memberships)
          .where(and(inArray(memberships.userId, ids), inArray(memberships.clubId, [...ctx.clubIds])));
  return { exists: new Set(found.map((r) => r.id)), sharesClub: new Set(mates.map((r) => r.id)) };
}
