import "server-only";
import { and, asc, eq, isNull } from "drizzle-orm";
import { strayPayment } from "@/lib/payments/fees";
import { nextStatus, type PaymentStatus } from "@/lib/payments/fees";
import type { PaymentChange } from "@/lib/payments/events";
import type { Database } from "../index";
import { contestEntries, contests, paymentEvents } from "../schema";

/** An entry of this contest (the contest in the WHERE) with its contest's fee settings; null when there is none. */
export async function entryOfContest(db: Database, p: { contestId: string; entryId: string }) {
  const [row] = await db.select({ entry: contestEntries, contest: contests }).from(contestEntries)
    .innerJoin(contests, eq(contests.id, contestEntries.contestId))
    .where(and(eq(contestEntries.id, p.entryId), eq(contestEntries.contestId, p.contestId)));
  return row ?? null;
}

type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];

/**
 * Applies one change to its entry (row locked), by the one rule of lib/payments/fees nextStatus: the
 * new status, "stray" for a payment that cannot settle the entry and must be given back
 * (lib/payments/fees strayPayment), or null when nothing changed.
 */
async function applyChange(tx: Tx, change: PaymentChange): Promise<PaymentStatus | "stray" | null> {
  const [row] = await tx.select({ entry: contestEntries, fee: contests.entryFeeCents, currency: contests.currency }).from(contestEntries)
    .innerJoin(contests, eq(contests.id, contestEntries.contestId)).where(eq(contestEntries.id, change.entryId)).for("update");
  if (!row) return null;
  if (change.kind === "paid" && strayPayment(row.entry, { feeCents: row.fee, currency: row.currency }, change)) return "stray";
  const next = nextStatus(row.entry.paymentStatus, change.kind);
  if (!next) return null;
  if (change.kind === "paid") {
    await tx.update(contestEntries).set({ paymentStatus: "paid", paymentRef: change.paymentRef, paidAt: new Date(), paymentMarkedBy: null }).where(eq(contestEntries.id, change.entryId));
  } else if (change.kind === "refunded") {
    if (row.entry.paymentRef !== change.paymentRef) return null;
    await tx.update(contestEntries).set({ paymentStatus: "refunded" }).where(eq(contestEntries.id, change.entryId));
  } else {
    await tx.update(contestEntries).set({ paymentStatus: "failed" }).where(eq(contestEntries.id, change.entryId));
  }
  return next;
}

/**
 * A verified webhook event: recorded by its id and applied in one transaction. "duplicate" when the
 * id was seen before (a redelivery changes nothing), "stray" for a payment to give back (the caller
 * refunds it, and calls {@link forgetPaymentEvent} when that fails so the redelivery tries again),
 * else "applied" or "ignored" (nothing to change).
 */
export async function applyPaymentEvent(db: Database, p: { eventId: string; type: string; change: PaymentChange | null }): Promise<"duplicate" | "applied" | "ignored" | "stray"> {
  return db.transaction(async (tx) => {
    const entry = p.change ? (await tx.select({ id: contestEntries.id }).from(contestEntries).where(eq(contestEntries.id, p.change.entryId)))[0] : undefined;
    const inserted = await tx.insert(paymentEvents).values({ id: p.eventId, type: p.type, entryId: entry?.id ?? null }).onConflictDoNothing().returning({ id: paymentEvents.id });
    if (inserted.length === 0) return "duplicate";
    if (!p.change || !entry) return "ignored";
    const outcome = await applyChange(tx, p.change);
    return outcome === "stray" ? "stray" : outcome ? "applied" : "ignored";
  });
}

/** Forgets a recorded event, so its redelivery is applied afresh (its stray payment's refund failed). */
export async function forgetPaymentEvent(db: Database, eventId: string): Promise<void> {
  await db.delete(paymentEvents).where(eq(paymentEvents.id, eventId));
}

/** The same change learnt without an event (the pilot's return from checkout, a refund's own reply); the new status or null (a stray payment is left to its webhook, which gives it back). */
export async function applyPaymentChange(db: Database, change: PaymentChange): Promise<PaymentStatus | null> {
  const outcome = await db.transaction((tx) => applyChange(tx, change));
  return outcome === "stray" ? null : outcome;
}

/** The officer marks an unpaid (or failed) live entry of this contest paid in cash; false when there is none such. */
export async function markCashPaid(db: Database, p: { contestId: string; entryId: string; officerId: string }): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(contestEntries)
      .where(and(eq(contestEntries.id, p.entryId), eq(contestEntries.contestId, p.contestId), isNull(contestEntries.withdrawnAt))).for("update");
    if (!row || nextStatus(row.paymentStatus, "paid") === null) return false;
    await tx.update(contestEntries).set({ paymentStatus: "paid", paymentRef: "cash", paidAt: new Date(), paymentMarkedBy: p.officerId }).where(eq(contestEntries.id, p.entryId));
    return true;
  });
}

/** Withdraws a live entry of this contest, marking it refunded when `refunded` (its card payment was given back). */
export async function withdrawWithRefund(db: Database, p: { contestId: string; entryId: string; refunded: boolean }): Promise<boolean> {
  const rows = await db.update(contestEntries)
    .set(p.refunded ? { withdrawnAt: new Date(), paymentStatus: "refunded" } : { withdrawnAt: new Date() })
    .where(and(eq(contestEntries.contestId, p.contestId), eq(contestEntries.id, p.entryId), isNull(contestEntries.withdrawnAt)))
    .returning({ id: contestEntries.id });
  return rows.length > 0;
}

/** The payment events recorded for an entry, oldest first (tests and the officer's record). */
export async function listPaymentEvents(db: Database, entryId: string) {
  return db.select().from(paymentEvents).where(eq(paymentEvents.entryId, entryId)).orderBy(asc(paymentEvents.receivedAt));
}
