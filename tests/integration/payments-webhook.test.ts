import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { POST as enterRoute } from "@/app/api/contests/[contestId]/entries/route";
import { DELETE as withdrawRoute } from "@/app/api/contests/[contestId]/entries/[entryId]/route";
import { POST as checkoutRoute } from "@/app/api/contests/[contestId]/entries/[entryId]/checkout/route";
import { POST as cashRoute } from "@/app/api/contests/[contestId]/entries/[entryId]/cash/route";
import { POST as webhookRoute } from "@/app/api/payments/webhook/route";
import { contestEntries, contests, paymentEvents } from "@/db/schema";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import { freshCast, type Cast } from "./support/authz-actors";
import { contestOfOwnersClub } from "./support/authz-contests";
import { eventsFor, pressOnPage, webhookRequest, type SentEvent } from "./support/payments";

/**
 * Issue 15, entry fees: a pilot enters a contest with a fee and pays at the local payments fake
 * (scripts/payments-server.ts); the fake's signed events are handed to the webhook route in-process.
 * The signature scheme is the payments service's documented one, checked by the `stripe` SDK's own
 * constructEvent (a reference implementation): a bad signature is refused, a redelivered event
 * changes nothing, a refund follows a withdrawal before entries close.
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

const FEE = 1500;
const json = (body?: unknown) => new Request("http://test/api", { method: "POST", headers: { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
const del = () => new Request("http://test/api", { method: "DELETE" });
const ctx = <T extends Record<string, string>>(params: T) => ({ params: Promise.resolve(params) });
const reply = async (res: Response) => ({ status: res.status, body: (await res.json()) as Record<string, unknown> });

/** A contest of a fresh cast's club with a fee, entries closing in a week (or `closed` an hour ago); the owner is its officer, otherPilot a member. */
async function feeContest(opts: { closed?: boolean } = {}): Promise<{ cast: Cast; contestId: string }> {
  const cast = await freshCast();
  const { contestId } = await contestOfOwnersClub(cast);
  await db.update(contests).set({ entryFeeCents: FEE, currency: "eur", entriesCloseAt: new Date(Date.now() + (opts.closed ? -3600_000 : 7 * 86_400_000)) }).where(eq(contests.id, contestId!));
  return { cast, contestId: contestId! };
}

/** otherPilot enters: the entry and the Checkout page the reply names. */
async function enter(cast: Cast, contestId: string) {
  actAs(cast.otherPilot);
  const res = await reply(await enterRoute(json({ modelIds: [] }), ctx({ contestId })));
  expect(res.status).toBe(201);
  return { entryId: (res.body.entry as { id: string }).id, checkoutUrl: res.body.checkoutUrl as string };
}

const entry = async (id: string) => (await db.select().from(contestEntries).where(eq(contestEntries.id, id)))[0]!;
const deliver = async (body: string, opts?: Parameters<typeof webhookRequest>[1]) => reply(await webhookRoute(webhookRequest(body, opts)));
async function lastEvent(entryId: string, type: string): Promise<SentEvent> {
  const found = (await eventsFor(entryId)).filter((e) => e.type === type).at(-1);
  expect(found, `the fake sent ${type}`).toBeDefined();
  return found!;
}

describe("entry fees through the payments fake and the webhook", () => {
  it("a declined card marks the entry failed, the retry's payment marks it paid; the fake's own signature header verifies", async () => {
    const { cast, contestId } = await feeContest();
    const { entryId, checkoutUrl } = await enter(cast, contestId);
    expect(checkoutUrl).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/pay\/cs_test_/);
    expect((await entry(entryId)).paymentStatus).toBe("pending");

    expect(await pressOnPage(checkoutUrl, "decline")).toBe(200);
    const failed = await lastEvent(entryId, "payment_intent.payment_failed");
    // the header exactly as the fake sent it
    expect(await deliver(failed.body, { signature: failed.signature })).toMatchObject({ status: 200, body: { outcome: "applied" } });
    expect((await entry(entryId)).paymentStatus).toBe("failed");

    // the retry: a new Checkout page from the pilot's own entry
    actAs(cast.otherPilot);
    const again = await reply(await checkoutRoute(json(), ctx({ contestId, entryId })));
    expect(again.status).toBe(201);
    expect(await pressOnPage(again.body.checkoutUrl as string, "pay")).toBe(303);
    const paid = await lastEvent(entryId, "checkout.session.completed");
    expect(await deliver(paid.body, { signature: paid.signature })).toMatchObject({ status: 200, body: { outcome: "applied" } });
    const row = await entry(entryId);
    expect(row.paymentStatus).toBe("paid");
    expect(row.paymentRef).toMatch(/^pi_test_/);
    expect(row.paidAt).toBeInstanceOf(Date);
    // paid: no further Checkout page
    actAs(cast.otherPilot);
    expect((await checkoutRoute(json(), ctx({ contestId, entryId }))).status).toBe(409);
  });

  it("refuses a bad signature (400) and changes nothing: wrong secret, no header, a changed body, a stale timestamp", async () => {
    const { cast, contestId } = await feeContest();
    const { entryId, checkoutUrl } = await enter(cast, contestId);
    await pressOnPage(checkoutUrl, "pay");
    const paid = await lastEvent(entryId, "checkout.session.completed");
    const eventId = (JSON.parse(paid.body) as { id: string }).id;
    const tampered = paid.body.replace(`"amount_total":${FEE}`, `"amount_total":${FEE + 1}`);
    expect(tampered).not.toBe(paid.body);
    const refusals = [
      await deliver(paid.body, { secret: "whsec_not_ours" }),
      await deliver(paid.body, { signature: null }),
      await deliver(paid.body, { signature: "t=1,v1=00" }),
      await deliver(tampered, { signature: paid.signature }),
      await deliver(paid.body, { timestamp: Math.floor(Date.now() / 1000) - 3600 }),
    ];
    expect(refusals.map((r) => [r.status, (r.body.error as { code: string }).code])).toEqual(Array(5).fill([400, "bad_signature"]));
    expect((await entry(entryId)).paymentStatus).toBe("pending");
    expect(await db.select().from(paymentEvents).where(eq(paymentEvents.id, eventId))).toEqual([]);
    // the same body, rightly signed, is taken
    expect((await deliver(paid.body)).body.outcome).toBe("applied");
    expect((await entry(entryId)).paymentStatus).toBe("paid");
  });

  it("a redelivered event changes nothing: the payment event after a refund leaves the entry refunded", async () => {
    const { cast, contestId } = await feeContest();
    const { entryId, checkoutUrl } = await enter(cast, contestId);
    await pressOnPage(checkoutUrl, "pay");
    const paid = await lastEvent(entryId, "checkout.session.completed");
    expect((await deliver(paid.body)).body.outcome).toBe("applied");
    expect((await deliver(paid.body)).body.outcome).toBe("duplicate");

    // the officer withdraws the entry before entries close: the card payment is refunded at the fake
    actAs(cast.owner);
    expect(await reply(await withdrawRoute(del(), ctx({ contestId, entryId })))).toMatchObject({ status: 200, body: { withdrawn: true, refunded: true } });
    expect((await entry(entryId)).paymentStatus).toBe("refunded");
    const refunded = await lastEvent(entryId, "charge.refunded");
    expect(JSON.parse(refunded.body)).toMatchObject({ data: { object: { payment_intent: (await entry(entryId)).paymentRef, refunded: true } } });
    // the refund event finds the entry refunded already; delivered again, it is a duplicate
    expect((await deliver(refunded.body)).body.outcome).toBe("ignored");
    expect((await deliver(refunded.body)).body.outcome).toBe("duplicate");
    // the payment's event redelivered (without the event store it would mark the entry paid again)
    expect((await deliver(paid.body)).body.outcome).toBe("duplicate");
    expect((await entry(entryId)).paymentStatus).toBe("refunded");
    // a second refund is refused by the payments service: withdrawing again finds no live entry
    actAs(cast.owner);
    expect((await withdrawRoute(del(), ctx({ contestId, entryId }))).status).toBe(404);
  });

  it("a failure never undoes a payment, and a payment of another amount does not settle the entry", async () => {
    const { cast, contestId } = await feeContest();
    const { entryId, checkoutUrl } = await enter(cast, contestId);
    const body = (id: string, object: Record<string, unknown>, type = "checkout.session.completed") => JSON.stringify({ id, object: "event", type, data: { object } });
    await pressOnPage(checkoutUrl, "pay");
    expect((await deliver((await lastEvent(entryId, "checkout.session.completed")).body)).body.outcome).toBe("applied");
    const late = body(`evt_test_late_${entryId.slice(0, 8)}`, { metadata: { entryId } }, "payment_intent.payment_failed");
    expect((await deliver(late)).body.outcome).toBe("ignored");
    expect((await entry(entryId)).paymentStatus).toBe("paid");
    // an event we do not use is acknowledged and recorded
    expect(await deliver(body(`evt_test_other_${entryId.slice(0, 8)}`, { id: "cus_x" }, "customer.created"))).toMatchObject({ status: 200, body: { outcome: "ignored" } });
    // not an event at all, rightly signed: 400, not a 500
    expect((await deliver(JSON.stringify({ hello: "world" }))).status).toBe(400);
  });

  it("a payment that cannot settle its entry is given back at once: a second page paid too, a withdrawn entry, a fee changed since the page", async () => {
    // two pages of one entry (two tabs), both paid: the first settles the entry, the second is refunded
    const { cast, contestId } = await feeContest();
    const { entryId, checkoutUrl } = await enter(cast, contestId);
    actAs(cast.otherPilot);
    const second = (await reply(await checkoutRoute(json(), ctx({ contestId, entryId })))).body.checkoutUrl as string;
    await pressOnPage(checkoutUrl, "pay");
    await pressOnPage(second, "pay");
    const [first, again] = (await eventsFor(entryId)).filter((e) => e.type === "checkout.session.completed");
    expect((await deliver(first!.body)).body.outcome).toBe("applied");
    const settled = (await entry(entryId)).paymentRef;
    expect(await deliver(again!.body)).toMatchObject({ status: 200, body: { outcome: "refunded" } });
    const secondRef = (JSON.parse(again!.body) as { data: { object: { payment_intent: string } } }).data.object.payment_intent;
    expect(secondRef).not.toBe(settled);
    const refunds = (await eventsFor(entryId)).filter((e) => e.type === "charge.refunded").map((e) => (JSON.parse(e.body) as { data: { object: { payment_intent: string } } }).data.object.payment_intent);
    expect(refunds).toEqual([secondRef]);
    expect(await entry(entryId)).toMatchObject({ paymentStatus: "paid", paymentRef: settled });
    // the same event again is a duplicate: no second refund
    expect((await deliver(again!.body)).body.outcome).toBe("duplicate");

    // the officer withdraws an unpaid entry; its pilot then pays on the page still open: refunded, still withdrawn and unpaid
    const other = await feeContest();
    const late = await enter(other.cast, other.contestId);
    actAs(other.cast.owner);
    expect((await withdrawRoute(del(), ctx({ contestId: other.contestId, entryId: late.entryId }))).status).toBe(200);
    await pressOnPage(late.checkoutUrl, "pay");
    expect((await deliver((await lastEvent(late.entryId, "checkout.session.completed")).body)).body.outcome).toBe("refunded");
    expect((await eventsFor(late.entryId)).filter((e) => e.type === "charge.refunded")).toHaveLength(1);
    expect(await entry(late.entryId)).toMatchObject({ paymentStatus: "pending", paymentRef: null });
    expect((await entry(late.entryId)).withdrawnAt).toBeInstanceOf(Date);

    // the officer lowers the fee after the page was made: the page's amount does not settle the entry and is given back
    const cheaper = await feeContest();
    const old = await enter(cheaper.cast, cheaper.contestId);
    await db.update(contests).set({ entryFeeCents: FEE - 500 }).where(eq(contests.id, cheaper.contestId));
    await pressOnPage(old.checkoutUrl, "pay");
    expect((await deliver((await lastEvent(old.entryId, "checkout.session.completed")).body)).body.outcome).toBe("refunded");
    expect((await entry(old.entryId)).paymentStatus).toBe("pending");
  });

  it("after entries close: a withdrawal keeps the card payment (no refund) and pilots cannot enter", async () => {
    const { cast, contestId } = await feeContest();
    const { entryId, checkoutUrl } = await enter(cast, contestId);
    await pressOnPage(checkoutUrl, "pay");
    await deliver((await lastEvent(entryId, "checkout.session.completed")).body);
    await db.update(contests).set({ entriesCloseAt: new Date(Date.now() - 60_000) }).where(eq(contests.id, contestId));
    actAs(cast.owner);
    expect(await reply(await withdrawRoute(del(), ctx({ contestId, entryId })))).toMatchObject({ status: 200, body: { withdrawn: true, refunded: false } });
    const row = await entry(entryId);
    expect([row.paymentStatus, row.withdrawnAt instanceof Date]).toEqual(["paid", true]);
    expect((await eventsFor(entryId)).filter((e) => e.type === "charge.refunded")).toEqual([]);
    actAs(cast.coachWithGrant); // a member of the club who has not entered
    expect(await reply(await enterRoute(json({ modelIds: [] }), ctx({ contestId })))).toMatchObject({ status: 409, body: { error: { code: "entries_closed" } } });
  });

  it("a pilot withdraws their own entry before entries close and gets the card payment back; nobody else's, and not after the deadline", async () => {
    const { cast, contestId } = await feeContest();
    const { entryId, checkoutUrl } = await enter(cast, contestId);
    await pressOnPage(checkoutUrl, "pay");
    await deliver((await lastEvent(entryId, "checkout.session.completed")).body);
    actAs(cast.coachWithGrant); // a member of the club, not the entry's pilot
    expect((await withdrawRoute(del(), ctx({ contestId, entryId }))).status).toBe(403);
    expect((await entry(entryId)).withdrawnAt).toBeNull();
    actAs(cast.otherPilot);
    expect(await reply(await withdrawRoute(del(), ctx({ contestId, entryId })))).toMatchObject({ status: 200, body: { withdrawn: true, refunded: true } });
    expect((await entry(entryId)).paymentStatus).toBe("refunded");
    expect((await eventsFor(entryId)).filter((e) => e.type === "charge.refunded")).toHaveLength(1);

    const late = await feeContest();
    const second = await enter(late.cast, late.contestId);
    await db.update(contests).set({ entriesCloseAt: new Date(Date.now() - 60_000) }).where(eq(contests.id, late.contestId));
    actAs(late.cast.otherPilot);
    expect(await reply(await withdrawRoute(del(), ctx({ contestId: late.contestId, entryId: second.entryId })))).toMatchObject({ status: 409, body: { error: { code: "entries_closed" } } });
    expect((await entry(second.entryId)).withdrawnAt).toBeNull();
  });

  it("the officer marks an unpaid entry paid in cash once; a member may not; another pilot cannot start paying someone's entry", async () => {
    const { cast, contestId } = await feeContest();
    const { entryId } = await enter(cast, contestId);
    actAs(cast.otherPilot);
    expect((await cashRoute(json(), ctx({ contestId, entryId }))).status).toBe(403);
    actAs(cast.owner);
    expect((await checkoutRoute(json(), ctx({ contestId, entryId }))).status).toBe(404);
    expect(await reply(await cashRoute(json(), ctx({ contestId, entryId })))).toMatchObject({ status: 200, body: { paymentStatus: "paid" } });
    const row = await entry(entryId);
    expect([row.paymentStatus, row.paymentRef, row.paymentMarkedBy]).toEqual(["paid", "cash", cast.owner.id]);
    expect((await cashRoute(json(), ctx({ contestId, entryId }))).status).toBe(409);
    // a cash entry withdrawn before the deadline calls no refund at the payments service
    expect(await reply(await withdrawRoute(del(), ctx({ contestId, entryId })))).toMatchObject({ status: 200, body: { refunded: false } });
  });

  it("a contest without a fee: entering gives no Checkout page, and there is nothing to pay or mark", async () => {
    const cast = await freshCast();
    const { contestId } = await contestOfOwnersClub(cast);
    actAs(cast.otherPilot);
    const res = await reply(await enterRoute(json({ modelIds: [] }), ctx({ contestId: contestId! })));
    expect(res).toMatchObject({ status: 201, body: { checkoutUrl: null } });
    const entryId = (res.body.entry as { id: string }).id;
    expect((await checkoutRoute(json(), ctx({ contestId: contestId!, entryId }))).status).toBe(409);
    actAs(cast.owner);
    expect((await cashRoute(json(), ctx({ contestId: contestId!, entryId }))).status).toBe(409);
  });
});
