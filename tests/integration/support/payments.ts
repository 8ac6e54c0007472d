import Stripe from "stripe";

/**
 * The local payments fake as the integration tests reach it (scripts/payments-server.ts, started by
 * scripts/integration-local.sh or npm test): its hosted page, the events it sent, and webhook
 * requests for the in-process route handler, signed with the SDK's own test helper.
 */
export function fakeUrl(): string {
  const url = process.env.STRIPE_API_URL;
  if (!url) throw new Error("STRIPE_API_URL is not set: run integration tests through scripts/integration-local.sh or npm test");
  return url;
}

/** Presses a button of the fake's hosted page ("pay" or "decline"); the page's status (303 after a payment). */
export async function pressOnPage(checkoutUrl: string, outcome: "pay" | "decline"): Promise<number> {
  const res = await fetch(checkoutUrl, { method: "POST", headers: { "content-type": "application/x-www-form-urlencoded" }, body: `outcome=${outcome}`, redirect: "manual" });
  await res.arrayBuffer();
  return res.status;
}

export type SentEvent = { id: string; type: string; body: string; signature: string };

/** The events the fake sent about one entry, oldest first (it delivers them to the app's address; the tests hand them to the route in-process). */
export async function eventsFor(entryId: string): Promise<SentEvent[]> {
  const all = (await (await fetch(`${fakeUrl()}/_fake/events`)).json()) as SentEvent[];
  return all.filter((e) => e.body.includes(entryId)).reverse();
}

/** A webhook request as the payments service sends it: the body, signed (by default with our secret, now). */
export function webhookRequest(body: string, opts: { secret?: string; timestamp?: number; signature?: string | null } = {}): Request {
  const secret = opts.secret ?? process.env.STRIPE_WEBHOOK_SECRET ?? "";
  const signature = opts.signature !== undefined ? opts.signature
    : new Stripe("sk_test_unused").webhooks.generateTestHeaderString({ payload: body, secret, timestamp: opts.timestamp });
  const headers: Record<string, string> = { "content-type": "application/json" };
  if (signature !== null) headers["stripe-signature"] = signature;
  return new Request("http://test/api/payments/webhook", { method: "POST", headers, body });
}
