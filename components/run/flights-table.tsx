import { creditedTargetText, reasonText, secondsText, STATUS_MARK } from "@/lib/field/display";
import { formatTenths, type LiveFlight } from "@/lib/tasks";
import { ScrollRegion } from "@/components/ui/scroll-region";

/**
 * A lane's flights in launch order: launch and landing (m:ss.t from the working-time start;
 * task C: from the attempt's signal), the flight time in tenths by the rules (the flown time
 * when the flight scores zero), what it adds, and its status as a word and a shape.
 */
export function FlightsTable({ flights, label }: { flights: readonly LiveFlight[]; label: string }) {
  if (flights.length === 0) return <p className="text-muted">No flights.</p>;
  return (
    <ScrollRegion label={`Flights, ${label}`} className="rounded-xl border-2 border-line">
      <table className="figures w-full text-sm [&_td]:whitespace-nowrap [&_td:last-child]:whitespace-normal" aria-label={`Flights, ${label}`}>
        <thead className="bg-surface text-left">
          <tr>
            <th scope="col" className="py-2 pl-2">#</th>
            <th scope="col" className="px-2 py-2">Launch</th>
            <th scope="col" className="px-2 py-2">Landing</th>
            <th scope="col" className="px-2 py-2 text-right">Time&nbsp;s</th>
            <th scope="col" className="px-2 py-2 text-right">Adds</th>
            <th scope="col" className="px-2 py-2">Status</th>
          </tr>
        </thead>
        <tbody>
          {flights.map((f) => {
            const flown = f.landMs === null ? null : f.airTenths;
            const time = f.status === "invalid" || f.timeTenths === 0 ? flown : f.timeTenths;
            const mark = STATUS_MARK[f.status];
            const why = f.status === "counted" ? null : reasonText(f.reason);
            return (
              <tr key={f.index} className="border-t-2 border-line align-top" data-flight-row={f.index + 1}>
                <td className="px-2 py-2 text-muted">{f.index + 1}{f.attempt !== null ? <span className="block text-xs">att. {f.attempt + 1}</span> : null}</td>
                <td className="px-2 py-2">{formatTenths(Math.trunc(f.launchMs / 100))}</td>
                <td className="px-2 py-2">{f.landMs === null ? "—" : formatTenths(Math.trunc(f.landMs / 100))}</td>
                <td className="px-2 py-2 text-right font-bold" data-testid="flight-time">{time === null ? "—" : secondsText(time)}</td>
                <td className="px-2 py-2 text-right">{secondsText(f.creditedTenths)}</td>
                <td className="px-2 py-2">
                  <span aria-hidden="true">{mark.symbol} </span>
                  {mark.label}
                  {creditedTargetText(f) ? <span className="block text-xs text-muted">{creditedTargetText(f)}</span> : null}
                  {why ? <span className="block text-xs text-muted">{why}</span> : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
