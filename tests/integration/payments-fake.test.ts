import "./support/session";
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Stripe from "stripe";
import { eq } from "drizzle-orm";
import { POST as enterRoute } from "@/app/api/contests/[contestId]/entries/route";
import { POST as webhookRoute } from "@/app/api/payments/webhook/route";
import { contestEntries, contests } from "@/db/schema";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import { freshCast } from "./support/authz-actors";
import { contestOfOwnersClub } from "./support/authz-contests";
import { eventsFor, fakeUrl, pressOnPage, webhookRequest } from "./support/payments";

/**
 * The local payments fake (scripts/payments-server.ts) behaves as the payments service's API reference
 * describes, where our code depends on it: a Checkout session closes at its expires_at (30 minutes to 24
 * hours ahead) and says so with checkout.session.expired; a webhook answered with an error is sent again
 * later, signed anew (the service's documented retries). Checked through the `stripe` SDK itself.
 */

const sdk = () => {
  const api = new URL(fakeUrl());
  return new Stripe(process.env.STRIPE_SECRET_KEY!, { host: api.hostname, port: Number(api.port), protocol: "http", maxNetworkRetries: 0 });
};
const session = (successUrl: string, extra: Partial<Stripe.Checkout.SessionCreateParams> = {}) => sdk().checkout.sessions.create({
  mode: "payment", client_reference_id: crypto.randomUUID(),
  line_items: [{ quantity: 1, price_data: { currency: "eur", unit_amount: 1200, product_data: { name: "Entry fee: test" } } }],
  success_url: successUrl, ...extra,
});
type Fake = { id: string; type: string; body: string; signature: string; attempts: number; status: number | string };
const sent = async (): Promise<Fake[]> => (await (await fetch(`${fakeUrl()}/_fake/events`)).json()) as Fake[];

let app: Server;
let hits: { body: string; signature: string }[] = [];
let answers: number[] = [];
beforeAll(async () => {
  // stands for the app's webhook endpoint: answers each delivery with the next status of `answers` (then 200)
  app = createServer((req, res) => {
    let body = "";
    req.on("data", (c: Buffer) => (body += c.toString("utf8")));
    req.on("end", () => {
      hits.push({ body, signature: String(req.headers["stripe-signature"] ?? "") });
      res.writeHead(answers.shift() ?? 200).end("{}");
    });
  });
  await new Promise<void>((resolve) => app.listen(0, "127.0.0.1", resolve));
});
afterAll(async () => {
  actAs(null);
  await new Promise((resolve) => app.close(resolve));
  await getPool().end();
});
const origin = () => `http://127.0.0.1:${(app.address() as AddressInfo).port}`;
async function until<T>(f: () => Promise<T | undefined> | T | undefined, ms = 15_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await f();
    if (v !== undefined) return v;
    if (Date.now() > end) throw new Error("timed out waiting");
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe("the payments fake, as the service's API reference describes it", () => {
  it("a webhook answered 500 is sent again later with a fresh valid signature, until a 2xx", async () => {
    hits = [];
    answers = [500];
    const s = await session(`${origin()}/back`);
    expect(await pressOnPage(s.url!, "pay")).toBe(303);
    await until(() => (hits.length >= 2 ? true : undefined));
    const [first, second] = hits;
    expect(second!.body).toBe(first!.body);
    const verify = (h: { body: string; signature: string }) => sdk().webhooks.constructEvent(h.body, h.signature, process.env.STRIPE_WEBHOOK_SECRET!);
    expect(verify(first!).type).toBe("checkout.session.completed");
    expect(verify(second!).id).toBe(verify(first!).id);
    const record = (await sent()).find((e) => e.id === verify(first!).id)!;
    expect([record.attempts, record.status]).toEqual([2, 200]);
    await new Promise((r) => setTimeout(r, 2500)); // past the next retry's time: a delivered event is not sent again
    expect(hits).toHaveLength(2);
  });

  it("a session's expires_at must be 30 minutes to 24 hours ahead; left out, 24 hours", async () => {
    const now = Math.floor(Date.now() / 1000);
    await expect(session(`${origin()}/back`, { expires_at: now + 10 * 60 })).rejects.toThrow(/expires_at/);
    await expect(session(`${origin()}/back`, { expires_at: now + 25 * 3600 })).rejects.toThrow(/expires_at/);
    const plain = await session(`${origin()}/back`);
    expect(Math.abs(plain.expires_at - (now + 24 * 3600))).toBeLessThan(60);
  });

  it("an expired page takes no payment and the app hears checkout.session.expired, which changes no entry", async () => {
    hits = [];
    answers = [];
    const s = await session(`${origin()}/back`, { expires_at: Math.floor(Date.now() / 1000) + 3600 });
    expect((await fetch(`${fakeUrl()}/_fake/sessions/${s.id}/expire`, { method: "POST" })).status).toBe(200);
    expect(await sdk().checkout.sessions.retrieve(s.id)).toMatchObject({ status: "expired", url: null });
    expect(await pressOnPage(s.url!, "pay")).toBe(200); // the page, saying it expired; no redirect, no payment
    const page = await (await fetch(s.url!)).text();
    expect(page).toContain("expired");
    const expired = await until(() => hits.find((h) => h.body.includes("checkout.session.expired")));
    expect(hits.some((h) => h.body.includes("checkout.session.completed"))).toBe(false);
    const res = await webhookRoute(webhookRequest(expired.body));
    expect(await res.json()).toMatchObject({ outcome: "ignored" });
  });

  it("entering a contest makes a page that closes when entries close, within the service's range", async () => {
    const cast = await freshCast();
    const { contestId } = await contestOfOwnersClub(cast);
    const close = new Date(Date.now() + 5 * 3600_000);
    await db.update(contests).set({ entryFeeCents: 1500, currency: "eur", entriesCloseAt: close }).where(eq(contests.id, contestId!));
    actAs(cast.otherPilot);
    const res = await enterRoute(new Request("http://test/api", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ modelIds: [] }) }), { params: Promise.resolve({ contestId: contestId! }) });
    const { entry, checkoutUrl } = (await res.json()) as { entry: { id: string }; checkoutUrl: string };
    const made = await sdk().checkout.sessions.retrieve(checkoutUrl.split("/pay/")[1]!);
    expect(made.expires_at).toBe(Math.floor(close.getTime() / 1000));
    expect(made.client_reference_id).toBe(entry.id);
    expect((await db.select().from(contestEntries).where(eq(contestEntries.id, entry.id)))[0]!.paymentStatus).toBe("pending");
    expect(await eventsFor(entry.id)).toEqual([]);
  });
});
