import { and, eq } from "drizzle-orm";
import { appLink } from "@/lib/mail/links";
import { startCheckout, sessionChange } from "@/lib/payments/server/checkout";
import type { Database } from "../index";
import { contestEntries, contests, users } from "../schema";

const FEE = 1500;
/** An invented pilot who entered on paper and withdrew before the fee was paid. */
const WITHDRAWN = "Rafe Dunmore";

/**
 * The demo contest's entry fee (15.00 EUR, entries close two days before) and entries in every
 * payment state: Tobi paid by card (through the local payments fake when it runs, else in cash),
 * Lena's card was declined, Ada has not paid yet, most paper entries paid in cash to the officer,
 * two not yet, and one withdrawn unpaid. Does nothing once the contest has its fee.
 */
export async function seedDemoFees(db: Database, contestName: string): Promise<void> {
  const [contest] = await db.select().from(contests).where(eq(contests.name, contestName));
  if (!contest || contest.entryFeeCents !== null) return;
  // entries close two days before the contest day, at 18:00 UTC
  const close = new Date(`${contest.startsOn}T18:00:00Z`);
  close.setUTCDate(close.getUTCDate() - 2);
  await db.update(contests).set({ entryFeeCents: FEE, currency: "eur", entriesCloseAt: close }).where(eq(contests.id, contest.id));
  const [officer] = await db.select({ id: users.id }).from(users).where(eq(users.email, "ines@example.com"));
  const entries = await db.select().from(contestEntries).where(eq(contestEntries.contestId, contest.id));
  const byEmail = async (email: string) => {
    const [u] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
    return entries.find((e) => e.pilotUserId === u?.id);
  };
  const cash = { paymentStatus: "paid" as const, paymentRef: "cash", paidAt: new Date(close.getTime() - 5 * 86_400_000), paymentMarkedBy: officer?.id ?? null };
  const tobi = await byEmail("tobi@example.com");
  if (tobi) {
    const ref = await demoCardPayment({ id: tobi.id, contestId: contest.id, contestName: contest.name });
    await db.update(contestEntries).set(ref ? { paymentStatus: "paid", paymentRef: ref, paidAt: new Date() } : cash).where(eq(contestEntries.id, tobi.id));
  }
  const lena = await byEmail("lena@example.com");
  if (lena) await db.update(contestEntries).set({ paymentStatus: "failed" }).where(eq(contestEntries.id, lena.id));
  const paper = entries.filter((e) => e.paper).sort((a, b) => a.pilotName.localeCompare(b.pilotName));
  // all but the last two paper entries (by name) paid in cash
  for (const e of paper.slice(0, -2)) await db.update(contestEntries).set(cash).where(eq(contestEntries.id, e.id));
  const [gone] = await db.select({ id: contestEntries.id }).from(contestEntries).where(and(eq(contestEntries.contestId, contest.id), eq(contestEntries.pilotName, WITHDRAWN)));
  if (!gone) await db.insert(contestEntries).values({ contestId: contest.id, pilotName: WITHDRAWN, paper: true, withdrawnAt: new Date(close.getTime() - 3 * 86_400_000) });
}

/** A real test payment at the local payments fake (STRIPE_API_URL): a Checkout session paid on its page; the payment's id, or null without the fake. */
async function demoCardPayment(entry: { id: string; contestId: string; contestName: string }): Promise<string | null> {
  if (!process.env.STRIPE_API_URL || !process.env.STRIPE_SECRET_KEY) return null;
  try {
    const session = await startCheckout({ entryId: entry.id, contestId: entry.contestId, contestName: entry.contestName, feeCents: FEE, currency: "eur", origin: new URL(appLink("/")).origin, expiresAt: new Date(Date.now() + 3600_000) });
    await fetch(session.url, { method: "POST", headers: { "content-type": "application/x-www-form-urlencoded" }, body: "outcome=pay", redirect: "manual" });
    const change = await sessionChange(session.id, entry.id);
    return change?.kind === "paid" ? change.paymentRef : null;
  } catch {
    return null;
  }
}
