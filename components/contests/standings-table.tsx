import { UNDER_DISPUTE } from "@/lib/contests/disputes";
import { RECORDS_UNDECIDED } from "@/lib/contests/records";
import type { PilotRow, Standings } from "@/lib/contests/standings";

const pts = (tenths: number | null) => (tenths === null ? "—" : (tenths / 10).toFixed(1));

function RoundCellText({ cell }: { cell: PilotRow["rounds"][number] }) {
  if (cell.pointsTenths === null) {
    return <><span className="text-muted" aria-label="not recorded yet">—</span>{cell.disputed && <span className="block text-xs font-bold text-warn">{UNDER_DISPUTE}</span>}
      {cell.undecided && <span className="block text-xs font-bold text-warn">{RECORDS_UNDECIDED}</span>}</>;
  }
  const text = pts(cell.pointsTenths);
  return (
    <>
      {cell.dropped ? <span aria-label={`${text}, dropped`}>({text})</span> : text}
      {!cell.signed && <span className="block text-xs font-bold text-danger">unsigned</span>}
      {cell.penaltyPoints > 0 && <span className="block text-xs">−{cell.penaltyPoints} pen.{cell.phonePenaltyPoints > 0 ? ` (${cell.phonePenaltyPoints} on the phone)` : ""}</span>}
      {cell.reflight && <span className="block text-xs">{cell.reflight.stands === "reflight" ? "re-flight stands" : "first flight stands"}</span>}
      {cell.disputed && <span className="block text-xs font-bold text-warn">{UNDER_DISPUTE}</span>}
      {cell.undecided && <span className="block text-xs font-bold text-warn">{RECORDS_UNDECIDED}</span>}
    </>
  );
}

function PilotTable({ caption, rounds, pilots, places }: { caption: string; rounds: Standings["rounds"]; pilots: PilotRow[]; places?: Map<string, number> }) {
  const rows = places ? [...pilots].sort((a, b) => (places.get(a.entryId) ?? 0) - (places.get(b.entryId) ?? 0)) : pilots;
  return (
    <div className="overflow-x-auto print:overflow-visible" tabIndex={0}>
      <table className="figures w-full border-collapse text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b-2 border-line text-left">
            <th scope="col" className="p-1">Place</th>
            <th scope="col" className="p-1">Pilot</th>
            {rounds.map((r) => <th scope="col" key={r.number} className="p-1 text-right">R{r.number}{r.letter ? ` ${r.letter}` : ""}</th>)}
            <th scope="col" className="p-1 text-right">Penalties</th>
            <th scope="col" className="p-1 text-right">Total</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((p) => (
            <tr key={p.entryId} className="border-b border-line align-top">
              <td className="p-1">{places?.get(p.entryId) ?? p.rank}{p.unresolvedTie && <span className="block text-xs font-bold">tie</span>}</td>
              <th scope="row" className="p-1 text-left font-semibold">{p.name}{p.team && <span className="block text-xs font-normal text-muted">{p.team}</span>}{p.withdrawn && <span className="block text-xs font-normal">withdrawn</span>}</th>
              {p.rounds.map((c) => <td key={c.roundNumber} className="p-1 text-right"><RoundCellText cell={c} /></td>)}
              <td className="p-1 text-right">{p.penaltyTenths > 0 ? `−${pts(p.penaltyTenths)}` : "0"}</td>
              <td className="p-1 text-right font-bold">{pts(p.totalTenths)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

const ordinal = (n: number) => `${n}${n % 100 >= 11 && n % 100 <= 13 ? "th" : ["th", "st", "nd", "rd"][n % 10] ?? "th"}`;

/**
 * The standings: places with each round's points (normalised per group, best = 1000; a dropped
 * round in brackets), penalties and totals; the fly-off and teams when there are any. Plain
 * markup, the same for members, the public link and print.
 */
export function StandingsTable({ standings }: { standings: Standings }) {
  if (standings.rounds.length === 0) return <p className="text-muted">No round has a result yet.</p>;
  const places = new Map(standings.final.map((f) => [f.pilotId, f.rank]));
  const ties = standings.pilots.some((p) => p.unresolvedTie);
  return (
    <div className="space-y-6">
      {!standings.valid && <p className="text-sm">{standings.rounds.length} of the 5 rounds a valid contest needs (F3K.10) have results so far.</p>}
      <section aria-labelledby="standings-heading" className="space-y-2">
        <h2 id="standings-heading" className="text-lg font-bold">Standings</h2>
        <PilotTable caption="Standings" rounds={standings.rounds} pilots={standings.pilots} places={places} />
        <p className="text-xs text-muted">
          Points per round: result ÷ best in the group × 1000 (F3K.9.1). A result not signed by pilot and timekeeper scores 0 (F3K.1.2).
          {" "}From 6 rounds the lowest is dropped (in brackets); penalties count even so (F3K.10).
          {ties && " Tie: equal total and equal dropped score, to be decided by a one-task fly-off (F3K.10)."}
        </p>
      </section>
      {standings.flyOff && (
        <section aria-labelledby="fly-off-heading" className="space-y-2">
          <h2 id="fly-off-heading" className="text-lg font-bold">Fly-off</h2>
          <p className="text-sm">{standings.flyOff.counted ? "The fly-off decides the top places." : "Fewer than 3 complete fly-off rounds: the preliminary order stands for now."}</p>
          <PilotTable caption="Fly-off" rounds={standings.flyOff.rounds} pilots={standings.flyOff.pilots} />
        </section>
      )}
      {standings.juniors.length > 0 && (
        <section aria-labelledby="juniors-heading" className="space-y-2">
          <h2 id="juniors-heading" className="text-lg font-bold">Juniors</h2>
          <ol aria-label="Juniors" className="space-y-1">
            {standings.juniors.map((j) => (
              <li key={j.entryId}><span className="font-semibold">{j.rank}. {j.name}</span> <span className="text-sm text-muted">({ordinal(j.overallRank)} overall)</span></li>
            ))}
          </ol>
          <p className="text-xs text-muted">Juniors fly in the same groups and are also ranked among themselves.</p>
        </section>
      )}
      {standings.teams.length > 0 && (
        <section aria-labelledby="teams-heading" className="space-y-2">
          <h2 id="teams-heading" className="text-lg font-bold">Teams</h2>
          <ol aria-label="Teams" className="space-y-1">
            {standings.teams.map((t) => (
              <li key={t.team}><span className="font-semibold">{t.rank}. {t.team}</span> · {pts(t.totalTenths)} <span className="text-sm text-muted">({t.counted.join(", ")})</span></li>
            ))}
          </ol>
          <p className="text-xs text-muted">Each team&apos;s three best members&apos; totals (F3K.10.4).</p>
        </section>
      )}
    </div>
  );
}
