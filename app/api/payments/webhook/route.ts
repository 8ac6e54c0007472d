// POST /api/payments/webhook — the payments service's events (a payment completed, failed or refunded), signed with
// STRIPE_WEBHOOK_SECRET; public by design: the signature is the credential. Each event id is applied once.
import { db } from "@/db";
import { applyPaymentEvent, forgetPaymentEvent } from "@/db/queries/contest-payments";
import { BODY_LIMIT, readBody, route } from "@/lib/api";
import { AppError } from "@/lib/errors";
import { changeOf, eventHeadSchema } from "@/lib/payments/events";
import { refundPayment } from "@/lib/payments/server/checkout";
import { verifiedEvent } from "@/lib/payments/server/stripe";

export const dynamic = "force-dynamic";

/**
 * 413 over 64 kB, 400 a missing, wrong or stale signature (nothing read further) or an event of another shape;
 * 200 with what it did (a redelivery: "duplicate"; a payment that cannot settle its entry: "refunded", given
 * back at once); 502 when that refund fails (the event is forgotten, so the service's redelivery tries again).
 */
export const POST = route(async (request: Request) => {
  const body = await readBody(request, BODY_LIMIT.default);
  const event = verifiedEvent(body, request.headers.get("stripe-signature"));
  if (!event) throw new AppError("bad_signature", "The payment event's signature does not verify.", 400);
  const head = eventHeadSchema.safeParse(event);
  if (!head.success) throw new AppError("bad_event", "The payment event is not of a known shape.", 400);
  const change = changeOf(head.data);
  const outcome = await applyPaymentEvent(db, { eventId: head.data.id, type: head.data.type, change });
  if (outcome === "stray" && change?.kind === "paid") {
    try {
      await refundPayment({ paymentRef: change.paymentRef, entryId: change.entryId, stray: true });
    } catch (e) {
      await forgetPaymentEvent(db, head.data.id);
      throw e;
    }
    return Response.json({ received: true, outcome: "refunded" }, { headers: { "cache-control": "no-store" } });
  }
  return Response.json({ received: true, outcome }, { headers: { "cache-control": "no-store" } });
});
