import type { EntryRow } from "@/db/queries/contests";
import { formatFee, paymentLabel } from "@/lib/payments/fees";
import { CashButton, PayButton } from "./payments";

type Contest = { id: string; entryFeeCents: number | null; currency: string };

/** The pilot's own entry fee: its state, and the button to pay (again) while unpaid. */
export function MyFee({ contest, mine, returned }: { contest: Contest; mine: EntryRow; returned: "done" | "cancelled" | null }) {
  if (contest.entryFeeCents === null) return null;
  const fee = formatFee(contest.entryFeeCents, contest.currency);
  const status = mine.paymentStatus;
  return (
    <div className="space-y-2 rounded-xl border border-line p-3" aria-label="Your entry fee" role="group">
      <p>Entry fee {fee}: <strong>{paymentLabel(mine)}</strong>.</p>
      {status === "failed" && <p role="status">Your last payment did not go through. No money was taken; you can pay again.</p>}
      {status === "pending" && returned === "done" && <p role="status">Your payment is being confirmed. Reload this page in a moment.</p>}
      {status === "pending" && returned === "cancelled" && <p role="status">You left the payment page without paying.</p>}
      {(status === "pending" || status === "failed") && <PayButton contestId={contest.id} entryId={mine.id} label={status === "failed" ? "Try the payment again" : "Pay the entry fee"} />}
    </div>
  );
}

function withdrawnFee(e: EntryRow): string {
  if (e.paymentStatus !== "paid") return paymentLabel(e);
  return e.paymentRef === "cash" ? "paid in cash (give it back by hand if due)" : "paid by card, kept (withdrawn after entries closed)";
}

/** The officer's view of the fees: who has not paid (with cash marking), and what happened to withdrawn entries' fees. */
export function OfficerFees({ contest, entries }: { contest: Contest; entries: EntryRow[] }) {
  if (contest.entryFeeCents === null) return null;
  const live = entries.filter((e) => !e.withdrawnAt);
  const unpaid = live.filter((e) => e.paymentStatus === "pending" || e.paymentStatus === "failed");
  const paid = live.filter((e) => e.paymentStatus === "paid");
  const withdrawn = entries.filter((e) => e.withdrawnAt);
  return (
    <section aria-labelledby="fees" className="space-y-2">
      <h2 id="fees" className="text-lg font-bold">Entry fees</h2>
      <p>{paid.length} of {live.length} entries paid · {formatFee(contest.entryFeeCents * paid.length, contest.currency)} taken</p>
      <h3 className="font-bold">Unpaid ({unpaid.length})</h3>
      {unpaid.length === 0 ? <p className="text-muted">Every entry is paid.</p> : (
        <ul aria-label="Unpaid entries" className="space-y-2">
          {unpaid.map((e) => (
            <li key={e.id} className="flex flex-wrap items-center gap-2">{e.pilotName} · {paymentLabel(e)} <CashButton contestId={contest.id} entryId={e.id} pilotName={e.pilotName} /></li>
          ))}
        </ul>
      )}
      {withdrawn.length > 0 && (
        <>
          <h3 className="font-bold">Withdrawn ({withdrawn.length})</h3>
          <ul aria-label="Withdrawn entries">{withdrawn.map((e) => <li key={e.id}>{e.pilotName} · {withdrawnFee(e)}</li>)}</ul>
        </>
      )}
    </section>
  );
}
