import "server-only";
import Stripe from "stripe";

/**
 * The payments API client (the `stripe` SDK). STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET come from
 * the environment; STRIPE_API_URL, set by our scripts in development and tests, points the SDK's host,
 * port and protocol at the local fake (scripts/payments-server.ts). Production leaves it unset.
 */
const cache = globalThis as unknown as { windowcallStripe?: { key: string; client: Stripe } };

export function payments(): Stripe {
  const secret = process.env.STRIPE_SECRET_KEY;
  if (!secret) throw new Error("payments are not configured (STRIPE_SECRET_KEY)");
  const api = process.env.STRIPE_API_URL;
  const key = `${secret}|${api ?? ""}`;
  if (cache.windowcallStripe?.key !== key) {
    const local = api ? new URL(api) : null;
    const client = new Stripe(secret, {
      maxNetworkRetries: 1,
      timeout: 15_000,
      telemetry: false,
      ...(local ? { host: local.hostname, port: Number(local.port || (local.protocol === "https:" ? 443 : 80)), protocol: local.protocol === "https:" ? "https" : "http" } : {}),
    });
    cache.windowcallStripe = { key, client };
  }
  return cache.windowcallStripe.client;
}

/** The verified event of a webhook request, or null when its signature is missing, wrong or too old (5 minutes). */
export function verifiedEvent(body: string, signature: string | null): Stripe.Event | null {
  const secret = process.env.STRIPE_WEBHOOK_SECRET;
  if (!secret) throw new Error("payments are not configured (STRIPE_WEBHOOK_SECRET)");
  if (!signature) return null;
  try {
    return payments().webhooks.constructEvent(body, signature, secret);
  } catch {
    return null;
  }
}
