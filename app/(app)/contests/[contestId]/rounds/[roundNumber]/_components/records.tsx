"use client";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";
import { formatTenths } from "@/lib/tasks";

export type RecordView = {
  id: string | null;
  /** "Paper card: 150.0 123.4" or "Phone run, lane 2". */
  what: string;
  resultTenths: number | null;
  recorded: string;
  signed: string;
};
/** `reflight`: the records of the pilot's re-flight grant (decided through `…/reflights/records`), not of their slot. */
export type RecordsRow = { entryId: string; name: string; groupNumber: number; reflight: boolean; current: RecordView; others: RecordView[] };

/**
 * A pilot's records of this round that wait for the officer: the counting one beside each kept one
 * (a phone run that replaced a paper card, a second run, a run a paper card outranks). The officer
 * counts one; the decision is kept with who and when, and the standings read the slot it sets. A
 * re-flight grant's records (a phone run and a paper card for the re-flight) are decided the same way,
 * and F3K.9.6 then picks which of the original and the re-flight stands.
 */
export function Records({ contestId, roundKey, rows }: { contestId: string; roundKey: string; rows: RecordsRow[] }) {
  return (
    <section aria-labelledby="records-title" className="space-y-3 rounded-xl border-2 border-line p-3">
      <h2 id="records-title" className="text-xl font-bold">Two records for one pilot</h2>
      {rows.length === 0 ? <p className="text-muted">No pilot has two records waiting for a decision.</p> : (
        <ul className="space-y-3">{rows.map((r) => <RecordsItem key={`${r.entryId}/${r.reflight}`} contestId={contestId} roundKey={roundKey} row={r} />)}</ul>
      )}
    </section>
  );
}

function RecordsItem({ contestId, roundKey, row }: { contestId: string; roundKey: string; row: RecordsRow }) {
  const { send, busy, error } = useSend();
  const all = [row.current, ...row.others];
  const agree = all.every((r) => r.resultTenths === row.current.resultTenths);
  const decide = (recordId: string | null) => send("PUT", `/api/contests/${contestId}/rounds/${roundKey}/${row.reflight ? "reflights/" : ""}records`, { entryId: row.entryId, recordId });
  const who = row.reflight ? `${row.name}'s re-flight` : row.name;
  return (
    <li aria-label={`Records, ${who}`} className="space-y-2">
      <p className="font-semibold">{who} ({row.reflight ? "flown in " : ""}group {row.groupNumber}): {agree ? "the records agree" : "the records disagree"}</p>
      <div className="grid gap-2 sm:grid-cols-2">
        {all.map((r, i) => (
          <div key={r.id ?? "current"} aria-label={i === 0 ? `Counting record, ${who}` : `Kept record ${i}, ${who}`} role="group" className="space-y-1 rounded-lg border border-line p-2">
            <p className="font-bold">{i === 0 ? "Counts now" : "Kept"}: {r.resultTenths === null ? "no result" : formatTenths(r.resultTenths)}</p>
            <p className="text-sm">{r.what}</p>
            <p className="text-sm text-muted">{r.recorded} · {r.signed}</p>
            <Button type="button" disabled={busy} onClick={() => void decide(r.id)}>{i === 0 ? "Keep this one" : "Count this one"}</Button>
          </div>
        ))}
      </div>
      <FormError message={error} />
    </li>
  );
}
