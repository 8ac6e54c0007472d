import "server-only";
import { asc, eq, inArray } from "drizzle-orm";
import type { Database } from "../index";
import { altimeterLogs, launchHeights, loggerMappings, modelOffers, modelRepairs, models } from "../schema";

/** The pilot's hangar in the account export: models with repairs, the offers they made of them, logs (not the files' keys) with their launches, logger mappings. */
export async function exportHangar(db: Database, userId: string) {
  const [modelRows, logRows, mappings, offers] = await Promise.all([
    db.select().from(models).where(eq(models.ownerId, userId)).orderBy(asc(models.createdAt)),
    db.select().from(altimeterLogs).where(eq(altimeterLogs.ownerId, userId)).orderBy(asc(altimeterLogs.createdAt)),
    db.select({ loggerName: loggerMappings.loggerName, mapping: loggerMappings.mapping }).from(loggerMappings).where(eq(loggerMappings.ownerId, userId)),
    db.select({ modelId: modelOffers.modelId, email: modelOffers.email, withHistory: modelOffers.withHistory, createdAt: modelOffers.createdAt, answer: modelOffers.answer, answeredAt: modelOffers.answeredAt })
      .from(modelOffers).where(eq(modelOffers.sellerId, userId)).orderBy(asc(modelOffers.createdAt)),
  ]);
  const modelIds = modelRows.map((m) => m.id);
  const logIds = logRows.map((l) => l.id);
  const [repairs, heights] = await Promise.all([
    modelIds.length ? db.select().from(modelRepairs).where(inArray(modelRepairs.modelId, modelIds)).orderBy(asc(modelRepairs.repairedOn)) : [],
    logIds.length ? db.select().from(launchHeights).where(inArray(launchHeights.logId, logIds)).orderBy(asc(launchHeights.atMs)) : [],
  ]);
  return {
    models: modelRows.map((m) => ({
      id: m.id, name: m.name, spanMm: m.spanMm, massG: m.massG, marking: m.marking, notes: m.notes, status: m.status, ownedSince: m.ownedSince, createdAt: m.createdAt,
      repairs: repairs.filter((r) => r.modelId === m.id),
    })),
    altimeterLogs: logRows.map((l) => ({
      id: l.id, runId: l.runId, lane: l.lane, fileName: l.fileName, loggerName: l.loggerName, sizeBytes: l.sizeBytes, status: l.status, samples: l.samples, createdAt: l.createdAt,
      launches: heights.filter((h) => h.logId === l.id),
    })),
    loggerMappings: mappings,
    modelOffers: offers,
  };
}
