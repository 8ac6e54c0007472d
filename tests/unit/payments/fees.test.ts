import { createHmac } from "node:crypto";
import Stripe from "stripe";
import { describe, expect, it } from "vitest";
import { changeOf } from "@/lib/payments/events";
import { checkoutExpiry, closesAt, entriesOpen, formatFee, nextStatus, paymentLabel, refundOnWithdrawal, strayPayment, type PaymentStatus } from "@/lib/payments/fees";
import { createContestSchema } from "@/lib/validations/contests";

const STATUSES: PaymentStatus[] = ["pending", "paid", "failed", "refunded"];

describe("nextStatus: one rule for webhook, return and cash", () => {
  it("a payment settles an unpaid or failed entry; a failure marks only an unpaid one; a refund only a paid one", () => {
    const table = Object.fromEntries(STATUSES.map((s) => [s, [nextStatus(s, "paid"), nextStatus(s, "failed"), nextStatus(s, "refunded")]]));
    expect(table).toEqual({
      pending: ["paid", "failed", null],
      paid: [null, null, "refunded"],
      failed: ["paid", null, null],
      refunded: [null, null, null],
    });
  });
});

describe("deadline and refunds", () => {
  const contest = { startsOn: "2027-01-16", entriesCloseAt: new Date("2027-01-14T18:00:00Z") };
  const paidByCard = { paymentStatus: "paid" as const, paymentRef: "pi_test_1" };
  it("entries are open strictly before the deadline; without one they stay open", () => {
    expect(entriesOpen(contest, new Date("2027-01-14T17:59:59Z"))).toBe(true);
    expect(entriesOpen(contest, new Date("2027-01-14T18:00:00Z"))).toBe(false);
    expect(entriesOpen({ entriesCloseAt: null }, new Date("2099-01-01T00:00:00Z"))).toBe(true);
  });
  it("a card payment is refunded on a withdrawal before the deadline, not after; cash and unpaid entries never through the service", () => {
    expect(refundOnWithdrawal(paidByCard, contest, new Date("2027-01-14T17:00:00Z"))).toBe(true);
    expect(refundOnWithdrawal(paidByCard, contest, new Date("2027-01-14T18:00:00Z"))).toBe(false);
    expect(refundOnWithdrawal({ paymentStatus: "paid", paymentRef: "cash" }, contest, new Date("2027-01-10T00:00:00Z"))).toBe(false);
    expect(refundOnWithdrawal({ paymentStatus: "pending", paymentRef: null }, contest, new Date("2027-01-10T00:00:00Z"))).toBe(false);
  });
  it("without a deadline, refunds run until the contest day begins (UTC)", () => {
    const open = { startsOn: "2027-01-16", entriesCloseAt: null };
    expect(closesAt(open).toISOString()).toBe("2027-01-16T00:00:00.000Z");
    expect(refundOnWithdrawal(paidByCard, open, new Date("2027-01-15T23:59:00Z"))).toBe(true);
    expect(refundOnWithdrawal(paidByCard, open, new Date("2027-01-16T08:00:00Z"))).toBe(false);
  });
  it("shows fees and states in words", () => {
    expect(formatFee(1500, "eur")).toBe("15.00 EUR");
    expect(formatFee(50, "gbp")).toBe("0.50 GBP");
    expect(paymentLabel({ paymentStatus: "paid", paymentRef: "cash" })).toBe("paid in cash");
    expect(paymentLabel({ paymentStatus: "paid", paymentRef: "pi_test_1" })).toBe("paid by card");
    expect(paymentLabel({ paymentStatus: "pending", paymentRef: null })).toBe("unpaid");
  });
});

describe("changeOf: what an event means for an entry", () => {
  const entryId = "0193a0e4-7a1b-7c2d-8e3f-405162738495";
  it("reads a completed session, a failed payment and a refund; anything else means nothing", () => {
    expect(changeOf({ type: "checkout.session.completed", data: { object: { client_reference_id: entryId, payment_status: "paid", payment_intent: "pi_1", amount_total: 1500, currency: "EUR" } } }))
      .toEqual({ kind: "paid", entryId, paymentRef: "pi_1", amount: 1500, currency: "eur" });
    expect(changeOf({ type: "payment_intent.payment_failed", data: { object: { metadata: { entryId } } } })).toEqual({ kind: "failed", entryId });
    expect(changeOf({ type: "charge.refunded", data: { object: { metadata: { entryId }, payment_intent: "pi_1", refunded: true } } })).toEqual({ kind: "refunded", entryId, paymentRef: "pi_1" });
    // a session not yet paid (an asynchronous method), a partial refund, an id that is not ours, another type
    expect(changeOf({ type: "checkout.session.completed", data: { object: { client_reference_id: entryId, payment_status: "unpaid", payment_intent: "pi_1", amount_total: 1500, currency: "eur" } } })).toBeNull();
    expect(changeOf({ type: "charge.refunded", data: { object: { metadata: { entryId }, payment_intent: "pi_1", refunded: false } } })).toBeNull();
    expect(changeOf({ type: "payment_intent.payment_failed", data: { object: { metadata: { entryId: "1; drop table" } } } })).toBeNull();
    expect(changeOf({ type: "customer.created", data: { object: {} } })).toBeNull();
  });
});

describe("the webhook signature scheme of scripts/payments-server.ts", () => {
  it("is the one the SDK verifies: t=<seconds>,v1=<hex HMAC-SHA256 of '<t>.<body>'>", () => {
    // the fake's signing, written out as its header comment documents it
    const secret = "whsec_unit";
    const body = JSON.stringify({ id: "evt_1", object: "event", type: "x", data: { object: {} } });
    const t = Math.floor(Date.now() / 1000);
    const header = `t=${t},v1=${createHmac("sha256", secret).update(`${t}.${body}`).digest("hex")}`;
    const sdk = new Stripe("sk_test_unit");
    expect(sdk.webhooks.constructEvent(body, header, secret).id).toBe("evt_1");
    expect(sdk.webhooks.generateTestHeaderString({ payload: body, secret, timestamp: t })).toBe(header);
    expect(() => sdk.webhooks.constructEvent(body, header, "whsec_other")).toThrow();
  });
});

describe("the set-up's fee fields", () => {
  const base = { name: "Evening cup", startsOn: "2027-03-14", fieldName: "North strip", rounds: [{ letter: "A" }], maxGroupSize: 8, prepMinutes: 5, noFlySeconds: 60, dropRule: "none", practice: true };
  it("a fee needs a closing time no later than the contest day; fees are whole cents from 0.50 to 1000.00", () => {
    expect(createContestSchema.safeParse(base).data).toMatchObject({ entryFeeCents: null, currency: "eur", entriesCloseAt: null });
    expect(createContestSchema.safeParse({ ...base, entryFeeCents: 1500, entriesCloseAt: "2027-03-12T18:00:00.000Z" }).success).toBe(true);
    const issues = (over: object) => createContestSchema.safeParse({ ...base, ...over }).error?.issues.map((i) => i.path.join("."));
    expect(issues({ entryFeeCents: 1500 })).toEqual(["entriesCloseAt"]);
    expect(issues({ entryFeeCents: 1500, entriesCloseAt: "2027-03-16T08:00:00Z" })).toEqual(["entriesCloseAt"]);
    expect(issues({ entryFeeCents: 49, entriesCloseAt: "2027-03-12T18:00:00Z" })).toEqual(["entryFeeCents"]);
    expect(issues({ entryFeeCents: 15.5, entriesCloseAt: "2027-03-12T18:00:00Z" })).toEqual(["entryFeeCents"]);
    expect(issues({ entryFeeCents: 100_001, entriesCloseAt: "2027-03-12T18:00:00Z" })).toEqual(["entryFeeCents"]);
    expect(issues({ currency: "xyz" })).toEqual(["currency"]);
    expect(issues({ entriesCloseAt: "0000-01-01T00:00:00Z" })).toEqual(["entriesCloseAt"]);
  });
});

describe("strayPayment: a card payment that cannot settle its entry is given back", () => {
  const fee = { feeCents: 1500, currency: "eur" };
  const pay = { paymentRef: "pi_2", amount: 1500, currency: "eur" };
  const live = { paymentStatus: "pending" as const, paymentRef: null, withdrawnAt: null };
  it("settles an unpaid or failed live entry at the contest's fee", () => {
    expect(strayPayment(live, fee, pay)).toBe(false);
    expect(strayPayment({ ...live, paymentStatus: "failed" }, fee, pay)).toBe(false);
  });
  it("the same payment learnt twice is not stray; a second payment, a withdrawn entry or another amount or currency is", () => {
    expect(strayPayment({ ...live, paymentStatus: "paid", paymentRef: "pi_2" }, fee, pay)).toBe(false);
    expect(strayPayment({ ...live, paymentStatus: "paid", paymentRef: "pi_1" }, fee, pay)).toBe(true);
    expect(strayPayment({ ...live, paymentStatus: "paid", paymentRef: "cash" }, fee, pay)).toBe(true);
    expect(strayPayment({ ...live, withdrawnAt: new Date(0) }, fee, pay)).toBe(true);
    expect(strayPayment(live, { ...fee, feeCents: 1000 }, pay)).toBe(true);
    expect(strayPayment(live, { ...fee, currency: "gbp" }, pay)).toBe(true);
    expect(strayPayment(live, { ...fee, feeCents: null }, pay)).toBe(true);
  });
});

describe("checkoutExpiry: a payment page closes when entries close, within the service's 30 min – 24 h", () => {
  const now = new Date("2026-06-01T10:00:00Z");
  const at = (iso: string | null) => checkoutExpiry({ entriesCloseAt: iso ? new Date(iso) : null, startsOn: "2026-06-20" }, now).toISOString();
  it("entries closing in 5 hours: the page closes then", () => expect(at("2026-06-01T15:00:00Z")).toBe("2026-06-01T15:00:00.000Z"));
  it("closing in 10 minutes (or past): 31 minutes ahead, the least the service takes plus a minute", () => {
    expect(at("2026-06-01T10:10:00Z")).toBe("2026-06-01T10:31:00.000Z");
    expect(at("2026-05-30T00:00:00Z")).toBe("2026-06-01T10:31:00.000Z");
  });
  it("closing in weeks, or no deadline (the contest day): a minute short of 24 hours", () => {
    expect(at("2026-06-15T00:00:00Z")).toBe("2026-06-02T09:59:00.000Z");
    expect(at(null)).toBe("2026-06-02T09:59:00.000Z");
  });
});
