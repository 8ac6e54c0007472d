import "server-only";
import { and, asc, desc, eq, sql } from "drizzle-orm";
import type { ModelInput } from "@/lib/validations/hangar";
import type { Database } from "../index";
import { modelRepairs, models, users } from "../schema";

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

export type TransferOutcome = { kind: "not-found" } | { kind: "no-buyer" } | { kind: "self" } | { kind: "done"; modelId: string };

/**
 * Hands a model to another account (a sale). With its history, the model itself changes hands:
 * repairs, launch heights and the seller's flights with it go along (the seller is kept in
 * former_owner_ids so those flights still count). Without, the seller's model is marked sold and
 * keeps its history; the buyer gets a new model with the same name, span, mass and marking.
 */
export async function transferModel(db: Database, p: { ownerId: string; modelId: string; email: string; withHistory: boolean }): Promise<TransferOutcome> {
  return db.transaction(async (tx) => {
    const [model] = await tx.select().from(models).where(and(eq(models.id, p.modelId), eq(models.ownerId, p.ownerId))).for("update");
    if (!model) return { kind: "not-found" } as const;
    const [buyer] = await tx.select({ id: users.id }).from(users)
      .where(and(eq(users.email, p.email), sql`${users.disabledAt} is null`, sql`${users.deletedAt} is null`));
    if (!buyer) return { kind: "no-buyer" } as const;
    if (buyer.id === p.ownerId) return { kind: "self" } as const;
    if (p.withHistory) {
      await tx.update(models).set({
        ownerId: buyer.id, status: "flying", ownedSince: new Date(),
        formerOwnerIds: sql`array_append(${models.formerOwnerIds}, ${p.ownerId}::uuid)`,
      }).where(eq(models.id, model.id));
      return { kind: "done", modelId: model.id } as const;
    }
    await tx.update(models).set({ status: "sold" }).where(eq(models.id, model.id));
    const [copy] = await tx.insert(models).values({
      ownerId: buyer.id, name: model.name, spanMm: model.spanMm, massG: model.massG, marking: model.marking, notes: "", status: "flying",
    }).returning({ id: models.id });
    return { kind: "done", modelId: copy!.id } as const;
  });
}
