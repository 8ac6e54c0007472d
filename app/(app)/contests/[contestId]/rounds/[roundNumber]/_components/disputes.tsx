"use client";
import Link from "next/link";
import { useState } from "react";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";
import { DISPUTE_ACTION_WORDS, DISPUTE_ACTIONS, disputeActionHref, type DisputeAction, type DisputeStatus } from "@/lib/contests/disputes";
import { formatClock } from "@/lib/format";

export type DisputeRow = {
  id: string; entryId: string; name: string; subject: string; lodgedBy: string; lodgedAt: string; recordedAt: string; recordedBy: string | null;
  status: DisputeStatus; outcome: string | null; action: DisputeAction | null; resolvedBy: string | null; resolvedAt: string | null;
};

const field = "mt-1 block min-h-12 w-full rounded-lg border border-line bg-raised p-2";

/**
 * The round's disputes: the officer writes down a pilot's or team manager's protest about a result
 * (what, who lodged it; who recorded it and when are kept), then resolves it, upheld or rejected, with
 * the outcome. An upheld dispute is carried out with an action that already exists (a re-flight, a
 * decision between records, the paper card, the penalty), linked from here; the dispute itself changes
 * no result. While open, the standings mark the result "under dispute".
 */
export function Disputes(p: { contestId: string; roundKey: string; timeZone: string; pilots: { entryId: string; name: string; groupNumber: number }[]; disputes: DisputeRow[] }) {
  const { send, busy, error } = useSend();
  const [entryId, setEntryId] = useState("");
  const [subject, setSubject] = useState("");
  const [lodgedBy, setLodgedBy] = useState("");
  const [lodgedAt, setLodgedAt] = useState("");
  async function lodge() {
    // datetime-local is the device's clock (the officer's, at the field); empty = now
    const when = lodgedAt === "" ? {} : { lodgedAt: new Date(lodgedAt).toISOString() };
    const reply = await send("POST", `/api/contests/${p.contestId}/rounds/${p.roundKey}/disputes`, { entryId, subject, lodgedBy, ...when });
    if (reply?.ok) { setEntryId(""); setSubject(""); setLodgedBy(""); setLodgedAt(""); }
  }
  return (
    <section aria-labelledby="disputes-title" className="space-y-4 rounded-xl border-2 border-line p-3">
      <h2 id="disputes-title" className="text-xl font-bold">Disputes</h2>
      <p className="text-sm text-muted">
        A protest about a result, as the pilot or their team manager lodged it. While it is open the results show the result as under dispute
        (on the public link too, without what or who). Upheld: carry it out with a re-flight, a decision between records, the paper card or the
        penalty, then record the outcome here.
      </p>
      {p.disputes.length === 0 && <p className="text-muted">No disputes in this round.</p>}
      <ul className="space-y-3">
        {p.disputes.map((d) => <DisputeItem key={d.id} contestId={p.contestId} roundKey={p.roundKey} timeZone={p.timeZone} d={d} />)}
      </ul>
      <form aria-label="Record a dispute" className="space-y-2 border-t border-line pt-3" onSubmit={(e) => { e.preventDefault(); void lodge(); }}>
        <h3 className="font-bold">Record a dispute</h3>
        <label className="block">Pilot whose result is disputed
          <select className={field} value={entryId} onChange={(e) => setEntryId(e.target.value)} required>
            <option value="">Choose a pilot</option>
            {p.pilots.map((x) => <option key={x.entryId} value={x.entryId}>{x.name} (group {x.groupNumber})</option>)}
          </select>
        </label>
        <label className="block">What is disputed
          <input className={field} value={subject} maxLength={300} required onChange={(e) => setSubject(e.target.value)} />
        </label>
        <label className="block">Lodged by (name; pilot or team manager)
          <input className={field} value={lodgedBy} maxLength={100} required onChange={(e) => setLodgedBy(e.target.value)} />
        </label>
        <label className="block">Lodged at (leave empty for now; not in the future, at most 2 days before the contest)
          <input type="datetime-local" className={field} value={lodgedAt} onChange={(e) => setLodgedAt(e.target.value)} />
        </label>
        <FormError message={error} />
        <Button type="submit" disabled={busy || entryId === "" || subject.trim() === "" || lodgedBy.trim() === ""}>Record the dispute</Button>
      </form>
    </section>
  );
}

function DisputeItem(p: { contestId: string; roundKey: string; timeZone: string; d: DisputeRow }) {
  const { d } = p;
  const { send, busy, error } = useSend();
  const [status, setStatus] = useState<"upheld" | "rejected">("rejected");
  const [action, setAction] = useState<DisputeAction>("reflight");
  const [outcome, setOutcome] = useState("");
  const when = (iso: string) => formatClock(new Date(iso), p.timeZone, "long");
  const href = d.action ? disputeActionHref(p.contestId, p.roundKey, d.action) : null;
  async function resolve() {
    await send("PUT", `/api/contests/${p.contestId}/rounds/${p.roundKey}/disputes`, { disputeId: d.id, status, outcome, action: status === "upheld" ? action : null });
  }
  return (
    <li aria-label={`Dispute, ${d.name}`} className="space-y-2 rounded-lg border border-line p-2">
      <p className="font-semibold">{d.name}: {d.subject} <span className="font-bold">({d.status})</span></p>
      <p className="text-sm text-muted">Lodged by {d.lodgedBy} on {when(d.lodgedAt)}, recorded by {d.recordedBy ?? "a former officer"} on {when(d.recordedAt)}.</p>
      {d.status !== "open" ? (
        <p className="text-sm">
          {d.status === "upheld" ? "Upheld" : "Rejected"} by {d.resolvedBy ?? "a former officer"} on {d.resolvedAt ? when(d.resolvedAt) : "?"}: {d.outcome}
          {d.action && <> · carried out by {href ? <Link className="underline" href={href}>{DISPUTE_ACTION_WORDS[d.action]}</Link> : DISPUTE_ACTION_WORDS[d.action]}</>}
        </p>
      ) : (
        <form aria-label={`Resolve the dispute, ${d.name}`} className="space-y-2" onSubmit={(e) => { e.preventDefault(); void resolve(); }}>
          <fieldset className="flex flex-wrap gap-4">
            <legend className="sr-only">Decision</legend>
            {(["upheld", "rejected"] as const).map((s) => (
              <label key={s} className="flex min-h-12 items-center gap-2">
                <input type="radio" className="h-6 w-6" name={`status-${d.id}`} checked={status === s} onChange={() => setStatus(s)} />
                {s === "upheld" ? "Upheld" : "Rejected"}
              </label>
            ))}
          </fieldset>
          {status === "upheld" && (
            <label className="block">Carried out by
              <select className={field} value={action} onChange={(e) => setAction(e.target.value as DisputeAction)}>
                {DISPUTE_ACTIONS.map((a) => <option key={a} value={a}>{DISPUTE_ACTION_WORDS[a]}</option>)}
              </select>
            </label>
          )}
          <label className="block">Outcome
            <input className={field} value={outcome} maxLength={500} required onChange={(e) => setOutcome(e.target.value)} />
          </label>
          <FormError message={error} />
          <Button type="submit" disabled={busy || outcome.trim() === ""}>Resolve {d.name}&apos;s dispute</Button>
        </form>
      )}
    </li>
  );
}
