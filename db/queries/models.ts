import "server-only";
import { and, asc, desc, eq, sql } from "drizzle-orm";
import type { ModelInput } from "@/lib/validations/hangar";
import type { Database } from "../index";
import { modelRepairs, models } from "../schema";

export type ModelRow = typeof models.$inferSelect;
export type RepairRow = typeof modelRepairs.$inferSelect;

/** The owner's models, flying ones first, then by name. */
export async function listModels(db: Database, p: { ownerId: string }): Promise<ModelRow[]> {
  return db.select().from(models).where(eq(models.ownerId, p.ownerId))
    .orderBy(sql`case ${models.status} when 'flying' then 0 when 'being-repaired' then 1 else 2 end`, asc(models.name));
}

/** One model of the owner's, or null (someone else's model is "not found" too). */
export async function getModel(db: Database, p: { ownerId: string; modelId: string }): Promise<ModelRow | null> {
  const [row] = await db.select().from(models).where(and(eq(models.id, p.modelId), eq(models.ownerId, p.ownerId)));
  return row ?? null;
}

export async function listRepairs(db: Database, p: { ownerId: string; modelId: string }): Promise<RepairRow[]> {
  return db.select({ r: modelRepairs }).from(modelRepairs).innerJoin(models, eq(models.id, modelRepairs.modelId))
    .where(and(eq(models.id, p.modelId), eq(models.ownerId, p.ownerId)))
    .orderBy(desc(modelRepairs.repairedOn), desc(modelRepairs.createdAt))
    .then((rows) => rows.map((x) => x.r));
}

export async function createModel(db: Database, p: { ownerId: string; input: ModelInput }): Promise<ModelRow> {
  const [row] = await db.insert(models).values({ ...p.input, ownerId: p.ownerId }).returning();
  return row!;
}

export async function updateModel(db: Database, p: { ownerId: string; modelId: string; input: Partial<ModelInput> }): Promise<ModelRow | null> {
  if (Object.keys(p.input).length === 0) return getModel(db, p);
  const [row] = await db.update(models).set(p.input).where(and(eq(models.id, p.modelId), eq(models.ownerId, p.ownerId))).returning();
  return row ?? null;
}

/** Adds a repair to the owner's model; with a mass after it, that becomes the model's mass. Null: no such model. */
export async function addRepair(
  db: Database,
  p: { ownerId: string; modelId: string; repair: { repairedOn: string; work: string; massAfterG: number | null } },
): Promise<RepairRow | null> {
  return db.transaction(async (tx) => {
    const [model] = await tx.select({ id: models.id }).from(models).where(and(eq(models.id, p.modelId), eq(models.ownerId, p.ownerId))).for("update");
    if (!model) return null;
    const [row] = await tx.insert(modelRepairs).values({ modelId: model.id, ...p.repair }).returning();
    if (p.repair.massAfterG !== null) await tx.update(models).set({ massG: p.repair.massAfterG }).where(eq(models.id, model.id));
    return row!;
  });
}
