import { z } from "zod";

/**
 * What a verified webhook event of the payments service means for an entry (pure: the route verifies
 * the signature first, db/queries/contest-payments.ts applies the change). Events we do not use, or
 * whose object does not name one of our entries, mean nothing (null) and are only acknowledged.
 */
export type PaymentChange =
  | { kind: "paid"; entryId: string; paymentRef: string; amount: number; currency: string }
  | { kind: "failed"; entryId: string }
  | { kind: "refunded"; entryId: string; paymentRef: string };

const entryId = z.uuid();
const ref = z.string().min(1).max(255);

const completed = z.object({
  client_reference_id: entryId,
  payment_status: z.literal("paid"),
  payment_intent: ref,
  amount_total: z.number().int().min(0),
  currency: z.string().min(3).max(3),
});
const failed = z.object({ metadata: z.object({ entryId }) });
const refunded = z.object({ metadata: z.object({ entryId }), payment_intent: ref, refunded: z.literal(true) });

/** The event's id and type, checked (ids are short ASCII at the service). */
export const eventHeadSchema = z.object({ id: z.string().min(1).max(255).regex(/^[\w-]+$/), type: z.string().min(1).max(100), data: z.object({ object: z.unknown() }) });

export function changeOf(event: { type: string; data: { object: unknown } }): PaymentChange | null {
  const o = event.data.object;
  if (event.type === "checkout.session.completed" || event.type === "checkout.session.async_payment_succeeded") {
    const s = completed.safeParse(o);
    return s.success ? { kind: "paid", entryId: s.data.client_reference_id, paymentRef: s.data.payment_intent, amount: s.data.amount_total, currency: s.data.currency.toLowerCase() } : null;
  }
  if (event.type === "payment_intent.payment_failed") {
    const s = failed.safeParse(o);
    return s.success ? { kind: "failed", entryId: s.data.metadata.entryId } : null;
  }
  if (event.type === "charge.refunded") {
    const s = refunded.safeParse(o);
    return s.success ? { kind: "refunded", entryId: s.data.metadata.entryId, paymentRef: s.data.payment_intent } : null;
  }
  return null;
}
