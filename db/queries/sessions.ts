import "server-only";
import { and, desc, eq, exists, or, sql } from "drizzle-orm";
import type { Database } from "../index";
import { fieldSessions, runLanes, runs } from "../schema";

export type SessionSummary = {
  id: string;
  fieldName: string;
  startedAt: Date;
  conditions: unknown;
  runCount: number;
  taskCodes: string[];
};

/** Sessions the user owns or flew in (as a lane pilot), newest first. */
export async function listRecentSessions(db: Database, params: { userId: string; limit: number }): Promise<SessionSummary[]> {
  const flewIn = exists(
    db
      .select({ one: sql`1` })
      .from(runs)
      .innerJoin(runLanes, eq(runLanes.runId, runs.id))
      .where(and(eq(runs.sessionId, fieldSessions.id), eq(runLanes.pilotUserId, params.userId))),
  );
  const rows = await db
    .select({
      id: fieldSessions.id,
      fieldName: fieldSessions.fieldName,
      startedAt: fieldSessions.startedAt,
      conditions: fieldSessions.conditions,
      runCount: sql<number>`(select count(*)::int from ${runs} where ${runs.sessionId} = ${fieldSessions.id})`,
      taskCodes: sql<string[]>`coalesce((select array_agg(distinct ${runs.taskCode}) from ${runs} where ${runs.sessionId} = ${fieldSessions.id}), '{}')`,
    })
    .from(fieldSessions)
    .where(or(eq(fieldSessions.ownerId, params.userId), flewIn))
    .orderBy(desc(fieldSessions.startedAt))
    .limit(params.limit);
  return rows;
}
