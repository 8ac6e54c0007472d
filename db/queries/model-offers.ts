import "server-only";
import { and, asc, eq, gt, isNull, ne, sql } from "drizzle-orm";
import { holdsVerifiedAddress } from "./users";
import type { Database } from "../index";
import { modelOffers, models, users } from "../schema";

/** How long an offer waits for its answer. */
export const MODEL_OFFER_TTL_MS = 30 * 24 * 3600 * 1000;

type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
const waiting = (now: Date) => and(isNull(modelOffers.answer), gt(modelOffers.expiresAt, now));

/**
 * The seller offers their model to whoever holds `email` (lower-case). Nothing here looks the
 * address up: the seller gets the same outcome whether or not it has an account. An earlier offer
 * of the same model still waiting is withdrawn (one offer per model). Null: not the seller's model, or sold.
 */
export async function offerModel(
  db: Database,
  p: { sellerId: string; modelId: string; email: string; withHistory: boolean; now?: Date },
): Promise<{ id: string } | null> {
  const now = p.now ?? new Date();
  return db.transaction(async (tx) => {
    const [model] = await tx.select({ id: models.id }).from(models)
      .where(and(eq(models.id, p.modelId), eq(models.ownerId, p.sellerId), ne(models.status, "sold"))).for("update");
    if (!model) return null;
    await tx.update(modelOffers).set({ answer: "withdrawn", answeredAt: now }).where(and(eq(modelOffers.modelId, model.id), isNull(modelOffers.answer)));
    const [row] = await tx.insert(modelOffers).values({
      modelId: model.id, sellerId: p.sellerId, email: p.email, withHistory: p.withHistory, expiresAt: new Date(now.getTime() + MODEL_OFFER_TTL_MS),
    }).returning({ id: modelOffers.id });
    return row!;
  });
}

/** The seller withdraws the model's waiting offer; false when there is none (or it is not their model). */
export async function withdrawModelOffer(db: Database, p: { sellerId: string; modelId: string; now?: Date }): Promise<boolean> {
  const now = p.now ?? new Date();
  const rows = await db.update(modelOffers).set({ answer: "withdrawn", answeredAt: now })
    .where(and(eq(modelOffers.modelId, p.modelId), eq(modelOffers.sellerId, p.sellerId), waiting(now))).returning({ id: modelOffers.id });
  return rows.length > 0;
}

/** The offer of the seller's model that waits for an answer, for the model's page. */
export async function waitingOfferOf(db: Database, p: { sellerId: string; modelId: string; now?: Date }) {
  const [row] = await db.select({ id: modelOffers.id, email: modelOffers.email, withHistory: modelOffers.withHistory, expiresAt: modelOffers.expiresAt })
    .from(modelOffers).where(and(eq(modelOffers.modelId, p.modelId), eq(modelOffers.sellerId, p.sellerId), waiting(p.now ?? new Date())));
  return row ?? null;
}

export type OfferToMe = { id: string; modelName: string; spanMm: number; massG: number; marking: string; sellerName: string; withHistory: boolean; expiresAt: Date };

/** Offers waiting for the account's answer: made to its address, by someone else, of a model the seller still holds. */
export async function listOffersToMe(db: Database, p: { user: { id: string; email: string }; now?: Date }): Promise<OfferToMe[]> {
  return db.select({
    id: modelOffers.id, modelName: models.name, spanMm: models.spanMm, massG: models.massG, marking: models.marking,
    sellerName: users.name, withHistory: modelOffers.withHistory, expiresAt: modelOffers.expiresAt,
  }).from(modelOffers)
    .innerJoin(models, and(eq(models.id, modelOffers.modelId), eq(models.ownerId, modelOffers.sellerId)))
    .innerJoin(users, eq(users.id, modelOffers.sellerId))
    .where(and(eq(modelOffers.email, p.user.email.toLowerCase()), holdsVerifiedAddress(p.user.id, modelOffers.email), ne(modelOffers.sellerId, p.user.id), waiting(p.now ?? new Date())))
    .orderBy(asc(modelOffers.createdAt));
}

export type AnswerOutcome = { kind: "not-found" } | { kind: "declined" } | { kind: "accepted"; modelId: string };

/**
 * The account answers an offer made to its address. Accepting moves the model in one transaction
 * (moveModel); an offer that is not theirs, already answered, expired, or whose model the seller no
 * longer holds is "not found".
 */
export async function answerModelOffer(
  db: Database,
  p: { user: { id: string; email: string }; offerId: string; answer: "accept" | "decline"; now?: Date },
): Promise<AnswerOutcome> {
  const now = p.now ?? new Date();
  return db.transaction(async (tx) => {
    const [offer] = await tx.select().from(modelOffers)
      .where(and(eq(modelOffers.id, p.offerId), eq(modelOffers.email, p.user.email.toLowerCase()), holdsVerifiedAddress(p.user.id, modelOffers.email), ne(modelOffers.sellerId, p.user.id), waiting(now)))
      .for("update");
    if (!offer) return { kind: "not-found" } as const;
    const [model] = await tx.select().from(models).where(and(eq(models.id, offer.modelId), eq(models.ownerId, offer.sellerId))).for("update");
    if (!model) return { kind: "not-found" } as const;
    if (p.answer === "decline") {
      await tx.update(modelOffers).set({ answer: "declined", answeredAt: now }).where(eq(modelOffers.id, offer.id));
      return { kind: "declined" } as const;
    }
    await tx.update(modelOffers).set({ answer: "accepted", answeredAt: now }).where(eq(modelOffers.id, offer.id));
    const modelId = await moveModel(tx, { model, buyerId: p.user.id, withHistory: offer.withHistory, now });
    return { kind: "accepted", modelId } as const;
  });
}

/**
 * Hands a model to its buyer (a sale). With its history, the model itself changes hands: repairs,
 * launch heights and the seller's flights with it go along (the seller is kept in former_owner_ids
 * so those flights still count). Without, the seller's model is marked sold and keeps its history;
 * the buyer gets a new model with the same name, span, mass and marking. Returns the buyer's model.
 */
async function moveModel(tx: Tx, p: { model: typeof models.$inferSelect; buyerId: string; withHistory: boolean; now: Date }): Promise<string> {
  if (p.withHistory) {
    await tx.update(models).set({
      ownerId: p.buyerId, status: "flying", ownedSince: p.now,
      formerOwnerIds: sql`array_append(${models.formerOwnerIds}, ${p.model.ownerId}::uuid)`,
    }).where(eq(models.id, p.model.id));
    return p.model.id;
  }
  await tx.update(models).set({ status: "sold" }).where(eq(models.id, p.model.id));
  const [copy] = await tx.insert(models).values({
    ownerId: p.buyerId, name: p.model.name, spanMm: p.model.spanMm, massG: p.model.massG, marking: p.model.marking, notes: "", status: "flying",
  }).returning({ id: models.id });
  return copy!.id;
}
