import Link from "next/link";
import { DISPUTE_ACTION_WORDS, disputeActionHref, type DisputeAction, type DisputeStatus } from "@/lib/contests/disputes";
import { roundKey, roundName } from "@/lib/contests/round-key";
import { formatClock } from "@/lib/format";

type Row = {
  id: string; roundNumber: number; isFlyOff: boolean; name: string; subject: string; lodgedBy: string; lodgedAt: Date; recordedAt: Date; recordedBy: string | null;
  status: DisputeStatus; outcome: string | null; action: DisputeAction | null; resolvedBy: string | null; resolvedAt: Date | null;
};

/** The contest's disputes for its officers: open ones first, each with who lodged and recorded it and when, the resolution and its action. */
export function ContestDisputes({ contestId, zone, disputes }: { contestId: string; zone: string; disputes: Row[] }) {
  const open = disputes.filter((d) => d.status === "open").length;
  return (
    <section aria-labelledby="disputes" className="space-y-2">
      <h2 id="disputes" className="text-lg font-bold">Disputes ({open} open, {disputes.length - open} resolved)</h2>
      {disputes.length === 0 ? <p className="text-muted">No dispute recorded. Record one on its round&apos;s page.</p> : (
        <ul aria-label="Disputes" className="space-y-2">
          {disputes.map((d) => {
            const ref = { number: d.roundNumber, flyOff: d.isFlyOff };
            const href = d.action ? disputeActionHref(contestId, roundKey(ref), d.action) : null;
            return (
              <li key={d.id}>
                <Link className="underline" href={`/contests/${contestId}/rounds/${roundKey(ref)}#disputes-title`}>{roundName(ref)}</Link>, {d.name}: {d.subject}
                {" "}<span className="font-bold">({d.status})</span>
                <span className="block text-sm text-muted">
                  Lodged by {d.lodgedBy} {formatClock(d.lodgedAt, zone, "short")}, recorded by {d.recordedBy ?? "a former officer"} {formatClock(d.recordedAt, zone, "short")}
                  {d.status !== "open" && <>; {d.status} by {d.resolvedBy ?? "a former officer"} {d.resolvedAt ? formatClock(d.resolvedAt, zone, "short") : ""}: {d.outcome}</>}
                  {d.action && <> · {href ? <Link className="underline" href={href}>{DISPUTE_ACTION_WORDS[d.action]}</Link> : DISPUTE_ACTION_WORDS[d.action]}</>}
                </span>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
