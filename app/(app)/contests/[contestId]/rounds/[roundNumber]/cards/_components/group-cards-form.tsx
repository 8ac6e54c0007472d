"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { sendJson } from "@/components/request/json";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";
import { PAPER_MAX_FLIGHTS, paperCardResult, readTimes } from "@/lib/contests/paper-card";
import { reasonText, STATUS_MARK } from "@/lib/field/display";
import { LinkedRunSelect, laneValue } from "@/components/contests/linked-run-select";
import { formatTenths, type TaskDefinition } from "@/lib/tasks";
import type { LinkableLane } from "@/lib/contests/linkable";

export type CardPilot = {
  entryId: string; name: string; flights: number[] | null; penaltyPoints: number; signed: boolean; recordedAt: string | null;
  /** The linked timed run's lane and its server result; leaving the times empty keeps it. */
  link: { runId: string; lane: number; resultTenths: number | null } | null;
};
export type LaneOption = LinkableLane;
type Row = { times: string; penalty: string; signed: boolean };

const tenthsText = (t: number) => (t / 10).toFixed(1);


function Check({ task, row, link }: { task: TaskDefinition; row: Row; link: CardPilot["link"] }) {
  const { flights, bad } = readTimes(row.times);
  if (bad !== null) return <p className="text-sm font-bold text-danger">&quot;{bad}&quot; is not a flight time.</p>;
  if (flights.length > PAPER_MAX_FLIGHTS) return <p className="text-sm font-bold text-danger">At most {PAPER_MAX_FLIGHTS} flights on one card.</p>;
  if (flights.length === 0) {
    return <p className="text-sm text-muted">{link ? `The timed run's result stands: ${link.resultTenths === null ? "nothing recorded in its lane" : formatTenths(link.resultTenths)}.` : "No flights: not recorded yet."}</p>;
  }
  const scored = paperCardResult(task, flights);
  return (
    <div className="text-sm">
      <p className="font-bold">Result {formatTenths(scored.tenths)}{scored.sumCapApplied ? " (working-time cap)" : ""}</p>
      <ul aria-label="Flights checked" className="flex flex-wrap gap-x-3">
        {scored.flights.map((f, i) => (
          <li key={i}>{STATUS_MARK[f.status].symbol} {tenthsText(flights[i]!)} s: {STATUS_MARK[f.status].label}{f.reason ? `, ${reasonText(f.reason)}` : ""}</li>
        ))}
      </ul>
    </div>
  );
}

/** One group's cards: per pilot the flight times, penalty points and the signature; saved together. */
export function GroupCardsForm(p: { contestId: string; /** The round's URL segment (lib/contests/round-key.ts). */ roundKey: string; groupNumber: number; task: TaskDefinition; pilots: CardPilot[]; lanes: LaneOption[]; /** The club's IANA zone: times shown on its clock. */ timeZone: string }) {
  const router = useRouter();
  const [rows, setRows] = useState<Record<string, Row>>(() => Object.fromEntries(p.pilots.map((x) => [x.entryId, {
    times: (x.flights ?? []).map(tenthsText).join(" "), penalty: String(x.penaltyPoints), signed: x.signed,
  }])));
  const [message, setMessage] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const set = (id: string, patch: Partial<Row>) => { setSaved(false); setRows((r) => ({ ...r, [id]: { ...r[id]!, ...patch } })); };
  async function save() {
    const cards = [];
    for (const x of p.pilots) {
      const row = rows[x.entryId]!;
      const { flights, bad } = readTimes(row.times);
      if (bad !== null) return setMessage(`${x.name}: "${bad}" is not a flight time.`);
      const penalty = row.penalty.trim() === "" ? 0 : Number(row.penalty);
      if (!Number.isInteger(penalty) || penalty < 0) return setMessage(`${x.name}: penalties are whole points, 0 or more.`);
      cards.push({ entryId: x.entryId, flights: flights.length === 0 ? null : flights, penaltyPoints: penalty, signed: row.signed });
    }
    const reply = await sendJson("PUT", `/api/contests/${p.contestId}/rounds/${p.roundKey}/cards`, { groupNumber: p.groupNumber, cards });
    if (reply.ok) { setMessage(null); setSaved(true); router.refresh(); } else setMessage(reply.issues?.map((i) => i.message).join(" ") || reply.message);
  }
  async function link(x: CardPilot, value: string) {
    const [runId, lane] = value === "" ? [null, null] : [value.split("#")[0]!, Number(value.split("#")[1])];
    const reply = await sendJson("PUT", `/api/contests/${p.contestId}/rounds/${p.roundKey}/runs`, { entryId: x.entryId, runId, lane });
    if (!reply.ok) return setMessage(reply.issues?.map((i) => i.message).join(" ") || reply.message);
    // the run's result replaces the card, and needs its own signature (F3K.1.2)
    set(x.entryId, { times: "", signed: false });
    setMessage(null);
    router.refresh();
  }
  const field = "mt-1 block min-h-12 w-full rounded-lg border border-line bg-raised p-2";
  return (
    <form aria-labelledby={`group-${p.groupNumber}`} className="card space-y-4 rounded-xl border border-line bg-raised p-3" onSubmit={(e) => { e.preventDefault(); void save(); }}>
      <h2 id={`group-${p.groupNumber}`} className="text-lg font-bold">Group {p.groupNumber}</h2>
      {p.pilots.map((x) => {
        const row = rows[x.entryId]!;
        return (
          <fieldset key={x.entryId} className="space-y-2 border-t border-line pt-3">
            <legend className="font-semibold">{x.name}</legend>
            <label className="block">Flight times of {x.name}
              <input className={`${field} figures`} inputMode="decimal" autoComplete="off" value={row.times} onChange={(e) => set(x.entryId, { times: e.target.value })} />
            </label>
            <Check task={p.task} row={row} link={x.link} />
            {(p.lanes.length > 0 || x.link) && (
              <LinkedRunSelect label={`Timed run of ${x.name}`} lanes={p.lanes} linked={x.link} value={x.link ? laneValue(x.link) : ""}
                onChange={(v) => void link(x, v)} timeZone={p.timeZone} className={field} />
            )}
            <div className="flex flex-wrap items-end gap-4">
              <label className="block w-32">Penalty points of {x.name}
                <input className={field} inputMode="numeric" value={row.penalty} onChange={(e) => set(x.entryId, { penalty: e.target.value })} />
              </label>
              <label className="flex min-h-12 items-center gap-2">
                <input type="checkbox" className="h-6 w-6" checked={row.signed} onChange={(e) => set(x.entryId, { signed: e.target.checked })} />
                Signed ({x.name})
              </label>
            </div>
          </fieldset>
        );
      })}
      <FormError message={message} />
      {saved && <p role="status" className="font-bold text-good">Group {p.groupNumber} saved.</p>}
      <Button type="submit">Save group {p.groupNumber}</Button>
    </form>
  );
}
