import Link from "next/link";
import type { MonthSummary, SeasonSummary } from "@/lib/season/types";
import { dayText, monthText, secondsText, shareText, taskText } from "./season-format";

/** This month against last (runs, flights, mean share, median turnaround) and the best result per task. */
export function SeasonHeadline({ summary }: { summary: SeasonSummary }) {
  const { months, bests, totals } = summary;
  return (
    <section aria-labelledby="season-headline" className="space-y-3">
      <h2 id="season-headline" className="text-lg font-bold">
        {totals.runs} runs, {totals.flights} flights
      </h2>
      <table className="w-full text-left">
        <caption className="text-left font-semibold">This month against last</caption>
        <thead>
          <tr>
            <th scope="col"></th>
            <th scope="col">{monthText(months.this.start)}</th>
            <th scope="col">{monthText(months.last.start)}</th>
          </tr>
        </thead>
        <tbody className="figures">
          <MonthRow label="Runs" pick={(m) => String(m.runs)} months={months} />
          <MonthRow label="Flights" pick={(m) => String(m.flights)} months={months} />
          <MonthRow label="Mean result" pick={(m) => shareText(m.share)} months={months} />
          <MonthRow label="Median turnaround" pick={(m) => secondsText(m.turnaroundTenths)} months={months} />
        </tbody>
      </table>
      <h3 className="font-semibold">Personal bests</h3>
      {bests.length === 0 ? (
        <p className="text-muted">No runs within these filters.</p>
      ) : (
        <ul className="grid grid-cols-2 gap-2">
          {bests.map((b) => (
            <li key={b.task}>
              <Link href={`/logbook/run?id=${b.runId}`} className="block rounded-lg border-2 border-line p-2">
                <span className="block text-sm font-semibold">{taskText(b.task)}</span>
                <span className="figures block text-lg font-extrabold">{secondsText(b.resultTenths)}</span>
                <span className="block text-sm text-muted">
                  {b.maxTenths ? `of ${secondsText(b.maxTenths)} · ` : ""}{dayText(b.day)}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function MonthRow({ label, pick, months }: { label: string; pick: (m: MonthSummary) => string; months: SeasonSummary["months"] }) {
  return (
    <tr>
      <th scope="row" className="font-normal">{label}</th>
      <td>{pick(months.this)}</td>
      <td>{pick(months.last)}</td>
    </tr>
  );
}
