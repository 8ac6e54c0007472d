/**
 * Entry fees: what the contest page and the routes decide about a fee, with no I/O. Amounts are in
 * the currency's smallest unit (cents), as the payments API takes them.
 */

/** Currencies an officer may charge in: two-decimal currencies the payments service takes (ISO 4217, lower case as its API writes them). */
export const CURRENCIES = ["eur", "gbp", "usd", "chf", "sek", "nok", "dkk", "pln", "czk", "cad", "aud", "nzd"] as const;
export type Currency = (typeof CURRENCIES)[number];

/** The smallest and largest fee a contest may ask (0.50 is the payments service's usual card minimum). */
export const MIN_FEE_CENTS = 50;
export const MAX_FEE_CENTS = 100_000;

export type PaymentStatus = "pending" | "paid" | "failed" | "refunded";

/** "15.00 EUR": the fee as the page shows it (no locale-dependent symbol). */
export function formatFee(cents: number, currency: string): string {
  return `${(cents / 100).toFixed(2)} ${currency.toUpperCase()}`;
}

/** The moment entries close: the deadline set, or else the start of the contest day (UTC). */
export function closesAt(contest: { entriesCloseAt: Date | null; startsOn: string }): Date {
  return contest.entriesCloseAt ?? new Date(`${contest.startsOn}T00:00:00Z`);
}

/**
 * When a payment page made now stops taking payments: when entries close, but no sooner than 30 minutes
 * and no later than 24 hours ahead (the range the payments service accepts for a Checkout session's
 * expires_at, per its API reference). An abandoned page cannot be paid weeks later; a second page or a
 * late payment is given back anyway (strayPayment).
 */
export function checkoutExpiry(contest: { entriesCloseAt: Date | null; startsOn: string }, now: Date): Date {
  const min = now.getTime() + 31 * 60_000; // a minute to spare for the request's way there
  const max = now.getTime() + 24 * 3600_000 - 60_000;
  return new Date(Math.min(max, Math.max(min, closesAt(contest).getTime())));
}

/** Pilots may enter strictly before the deadline the officer set (no deadline: entries stay open). */
export function entriesOpen(contest: { entriesCloseAt: Date | null }, now: Date): boolean {
  return contest.entriesCloseAt === null || now.getTime() < contest.entriesCloseAt.getTime();
}

/** A card payment's reference at the payments service (a payment id), as opposed to "cash" or a checkout still open. */
export function isCardPayment(ref: string | null): ref is string {
  return ref !== null && ref.startsWith("pi_");
}

/** Whether withdrawing this entry now gives the card payment back: paid by card and entries still open. */
export function refundOnWithdrawal(entry: { paymentStatus: PaymentStatus; paymentRef: string | null }, contest: { entriesCloseAt: Date | null; startsOn: string }, now: Date): boolean {
  return entry.paymentStatus === "paid" && isCardPayment(entry.paymentRef) && now.getTime() < closesAt(contest).getTime();
}

/** The status in words, for the entry list. */
export function paymentLabel(entry: { paymentStatus: PaymentStatus; paymentRef: string | null }): string {
  switch (entry.paymentStatus) {
    case "paid":
      return entry.paymentRef === "cash" ? "paid in cash" : "paid by card";
    case "failed":
      return "payment failed";
    case "refunded":
      return "refunded";
    default:
      return "unpaid";
  }
}

/**
 * A card payment that cannot settle its entry and is given back at once: the entry was withdrawn, or
 * is settled already by another payment (a second page paid too), or the amount or currency is not
 * the contest's fee now (the officer changed it after the page was made). The same payment learnt
 * twice (the return from checkout, then its event) is not stray.
 */
export function strayPayment(
  entry: { paymentStatus: PaymentStatus; paymentRef: string | null; withdrawnAt: Date | null },
  contest: { feeCents: number | null; currency: string },
  payment: { paymentRef: string; amount: number; currency: string },
): boolean {
  if (entry.paymentRef === payment.paymentRef) return false;
  if (entry.withdrawnAt !== null) return true;
  if (entry.paymentStatus === "paid" || entry.paymentStatus === "refunded") return true;
  return contest.feeCents === null || payment.amount !== contest.feeCents || payment.currency !== contest.currency;
}

/**
 * The next status on a payment event, or null when the event changes nothing: a payment completes
 * an unpaid or failed entry; a failure marks only an unpaid one (never undoes a payment); a refund
 * applies to a paid entry.
 */
export function nextStatus(current: PaymentStatus, event: "paid" | "failed" | "refunded"): PaymentStatus | null {
  if (event === "paid") return current === "pending" || current === "failed" ? "paid" : null;
  if (event === "failed") return current === "pending" ? "failed" : null;
  return current === "paid" ? "refunded" : null;
}
