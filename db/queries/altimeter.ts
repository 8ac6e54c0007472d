import "server-only";
import { and, asc, eq, lt, sql } from "drizzle-orm";
import type { LoggerMapping } from "@/lib/altimeter/mapping";
import { flightInstants } from "@/lib/results/flight-instants";
import type { Database } from "../index";
import { altimeterLogs, launchHeights, loggerMappings, runLanes, runs } from "../schema";

export type LogRow = typeof altimeterLogs.$inferSelect;
export type RunAccess = { runId: string; createdBy: string; startMs: number; lanes: { lane: number; pilotUserId: string | null; pilotName: string }[] };

/** The run if the user may see it (its recorder or one of its pilots), else null. */
export async function runForViewer(db: Database, p: { userId: string; runId: string }): Promise<RunAccess | null> {
  const [run] = await db.select().from(runs).where(eq(runs.id, p.runId));
  if (!run) return null;
  const lanes = await db.select({ lane: runLanes.lane, pilotUserId: runLanes.pilotUserId, pilotName: runLanes.pilotName }).from(runLanes)
    .where(eq(runLanes.runId, run.id)).orderBy(asc(runLanes.lane));
  if (run.createdBy !== p.userId && !lanes.some((l) => l.pilotUserId === p.userId)) return null;
  return { runId: run.id, createdBy: run.createdBy, startMs: run.createdAt.getTime(), lanes };
}

/** A lane's log belongs to its pilot; a lane with no account belongs to whoever recorded the run. */
export function mayUploadFor(run: RunAccess, lane: number, userId: string): boolean {
  const l = run.lanes.find((x) => x.lane === lane);
  if (!l) return false;
  return l.pilotUserId === userId || (l.pilotUserId === null && run.createdBy === userId);
}

export async function createPendingLog(db: Database, p: Omit<typeof altimeterLogs.$inferInsert, "id" | "status">): Promise<LogRow> {
  const [row] = await db.insert(altimeterLogs).values({ ...p, status: "pending" }).returning();
  return row!;
}

/** The user's own log, or null. */
export async function getOwnLog(db: Database, p: { ownerId: string; logId: string }): Promise<LogRow | null> {
  const [row] = await db.select().from(altimeterLogs).where(and(eq(altimeterLogs.id, p.logId), eq(altimeterLogs.ownerId, p.ownerId)));
  return row ?? null;
}

/** The owner's uploads still "pending" (never completed) that were asked for before `before`. */
export async function listStalePendingLogs(db: Database, p: { ownerId: string; before: Date }): Promise<Pick<LogRow, "id" | "objectKey">[]> {
  return db.select({ id: altimeterLogs.id, objectKey: altimeterLogs.objectKey }).from(altimeterLogs)
    .where(and(eq(altimeterLogs.ownerId, p.ownerId), eq(altimeterLogs.status, "pending"), lt(altimeterLogs.createdAt, p.before)));
}

export async function deleteLog(db: Database, logId: string): Promise<void> {
  await db.delete(altimeterLogs).where(eq(altimeterLogs.id, logId));
}

/** The lane's flights as last derived, and its model choices (undone ones left out), on the corrected clock. */
export async function laneFlightsAndModels(db: Database, p: { runId: string; lane: number }) {
  const [row] = await db.select({ derived: runLanes.derived }).from(runLanes).where(and(eq(runLanes.runId, p.runId), eq(runLanes.lane, p.lane)));
  const flights = flightInstants(row?.derived);
  const choices = await db.execute<{ at_ms: number; model_id: string }>(sql`
    select e.corrected_ms as at_ms, e.body->>'modelId' as model_id from events e
    where e.run_id = ${p.runId} and e.kind = 'model' and (e.body->>'lane')::int = ${p.lane}
      and not exists (select 1 from events v where v.run_id = e.run_id and v.kind = 'void' and v.body->>'targetId' = e.id::text)`);
  return { flights, choices: choices.rows.map((c) => ({ atMs: Number(c.at_ms), modelId: c.model_id })) };
}

export type HeightInsert = { atMs: number; heightM: number; flightIndex: number | null; gapMs: number | null; modelId: string | null };

/** Marks the log parsed with its launches, and saves the mapping for the logger; one transaction. */
export async function storeParsedLog(db: Database, p: { log: LogRow; samples: number; heights: HeightInsert[]; mapping: LoggerMapping }): Promise<void> {
  await db.transaction(async (tx) => {
    await tx.update(altimeterLogs).set({ status: "parsed", samples: p.samples }).where(eq(altimeterLogs.id, p.log.id));
    if (p.heights.length) {
      await tx.insert(launchHeights).values(p.heights.map((h) => ({ ...h, logId: p.log.id, runId: p.log.runId, lane: p.log.lane })));
    }
    await tx.insert(loggerMappings).values({ ownerId: p.log.ownerId, loggerName: p.log.loggerName, mapping: p.mapping })
      .onConflictDoUpdate({ target: [loggerMappings.ownerId, loggerMappings.loggerName], set: { mapping: p.mapping, updatedAt: new Date() } });
  });
}

export async function listLoggerMappings(db: Database, p: { ownerId: string }) {
  return db.select({ loggerName: loggerMappings.loggerName, mapping: loggerMappings.mapping }).from(loggerMappings)
    .where(eq(loggerMappings.ownerId, p.ownerId)).orderBy(sql`${loggerMappings.updatedAt} desc`);
}

/** A run's parsed logs and their launches, for someone runForViewer let in. */
export async function listRunLaunchHeights(db: Database, p: { runId: string }) {
  const logs = await db.select().from(altimeterLogs).where(and(eq(altimeterLogs.runId, p.runId), eq(altimeterLogs.status, "parsed"))).orderBy(asc(altimeterLogs.createdAt));
  const heights = await db.select().from(launchHeights).where(eq(launchHeights.runId, p.runId)).orderBy(asc(launchHeights.atMs));
  return logs.map((l) => ({
    id: l.id, lane: l.lane, fileName: l.fileName, loggerName: l.loggerName, samples: l.samples,
    launches: heights.filter((h) => h.logId === l.id).map((h) => ({ atMs: h.atMs, heightM: h.heightM, flightIndex: h.flightIndex, gapMs: h.gapMs })),
  }));
}

/** The storage keys of every log the user uploaded (to delete the files with the account). */
export async function listOwnLogKeys(db: Database, p: { ownerId: string }): Promise<string[]> {
  const rows = await db.select({ key: altimeterLogs.objectKey }).from(altimeterLogs).where(eq(altimeterLogs.ownerId, p.ownerId));
  return rows.map((r) => r.key);
}
