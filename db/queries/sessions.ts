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

/**
 * Sessions the user owns or flew in (as a lane pilot), newest first. The counts name their tables
 * in plain SQL: a column interpolated into a select's sql`` renders without its table and would
 * bind to the inner query.
 */
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
      runCount: sql<number>`(select count(*)::int from runs r where r.session_id = "field_sessions"."id")`,
      taskCodes: sql<string[]>`coalesce((select array_agg(distinct r.task_code order by r.task_code) from runs r where r.session_id = "field_sessions"."id"), '{}')`,
    })
    .from(fieldSessions)
    .where(or(eq(fieldSessions.ownerId, params.userId), flewIn))
    .orderBy(desc(fieldSessions.startedAt))
    .limit(params.limit);
  return rows;
}
