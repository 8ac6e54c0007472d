import "server-only";
import { AppError } from "@/lib/errors";
import { changeOf, type PaymentChange } from "@/lib/payments/events";
import { payments } from "./stripe";

/** The payments service failed or could not be reached: a 502 the pilot can retry, never a 500. */
export class PaymentServiceError extends AppError {
  constructor(message = "The payments service did not answer. Try again in a moment.") {
    super("payments_unavailable", message, 502);
  }
}

async function call<T>(f: () => Promise<T>): Promise<T> {
  try {
    return await f();
  } catch (e) {
    console.error("[payments]", (e as Error).message);
    throw new PaymentServiceError();
  }
}

/**
 * A Checkout session for one entry's fee; the pilot is sent to its `url` and comes back to the
 * contest page (`session_id` in the query when paid); the page closes at `expiresAt`. The entry's id travels as client_reference_id
 * and in the payment's metadata, so the webhook finds the entry.
 */
export async function startCheckout(p: { entryId: string; contestId: string; contestName: string; feeCents: number; currency: string; origin: string; expiresAt: Date }) {
  const back = `${p.origin}/contests/${p.contestId}`;
  const session = await call(() => payments().checkout.sessions.create({
    mode: "payment",
    line_items: [{ quantity: 1, price_data: { currency: p.currency, unit_amount: p.feeCents, product_data: { name: `Entry fee: ${p.contestName}` } } }],
    client_reference_id: p.entryId,
    metadata: { entryId: p.entryId, contestId: p.contestId },
    payment_intent_data: { metadata: { entryId: p.entryId, contestId: p.contestId } },
    success_url: `${back}?payment=done&session_id={CHECKOUT_SESSION_ID}`,
    cancel_url: `${back}?payment=cancelled`,
    expires_at: Math.floor(p.expiresAt.getTime() / 1000),
  }, { idempotencyKey: `checkout-${p.entryId}-${Date.now()}` }));
  if (!session.url) throw new PaymentServiceError("The payments service gave no page to pay on.");
  return { id: session.id, url: session.url };
}

/** What a returning pilot's session says about their entry (retrieved, never trusted from the query): a "paid" change, or null. */
export async function sessionChange(sessionId: string, entryId: string): Promise<PaymentChange | null> {
  const session = await call(() => payments().checkout.sessions.retrieve(sessionId));
  const change = changeOf({ type: "checkout.session.completed", data: { object: session } });
  return change && change.entryId === entryId ? change : null;
}

/**
 * Gives a card payment back whole. One refund per entry on withdrawal (the idempotency key), so a
 * retried withdrawal cannot refund twice; a stray payment (lib/payments/fees strayPayment) is keyed by
 * the payment itself.
 */
export async function refundPayment(p: { paymentRef: string; entryId: string; stray?: boolean }): Promise<void> {
  const idempotencyKey = p.stray ? `refund-${p.paymentRef}` : `refund-${p.entryId}`;
  await call(() => payments().refunds.create({ payment_intent: p.paymentRef, metadata: { entryId: p.entryId } }, { idempotencyKey }));
}
