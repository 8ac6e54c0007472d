import { describeLiftTimeline } from "@/lib/days/lift-sentence";
import type { LiftBin } from "@/lib/days/lift-timeline";
import { quarterText } from "./day-format";

/**
 * The lift timeline: one cell per quarter hour, darker where flights beat their pilots' own
 * medians by more. The strip is a picture for sighted readers; the sentence above it and the
 * table under it (for screen readers only) say the same in words.
 */
export function LiftStrip({ bins, timeZone }: { bins: LiftBin[]; timeZone: string }) {
  const sentence = describeLiftTimeline(bins, (ms) => `${quarterText(ms, timeZone)} ${timeZone}`);
  return (
    <section aria-labelledby="lift" className="space-y-3">
      <h2 id="lift" className="text-lg font-bold">
        Lift timeline
      </h2>
      <p data-testid="lift-sentence">{sentence}</p>
      {bins.length > 0 ? (
        <>
          <div aria-hidden="true">
            <div className="flex w-full gap-px" data-testid="lift-strip">
              {bins.map((b) => (
                <div
                  key={b.startMs}
                  title={`${quarterText(b.startMs, timeZone)}: ${b.flights} flights`}
                  className="h-10 min-w-0 flex-1 rounded-sm border border-line"
                  style={{ backgroundColor: `rgb(234 88 12 / ${b.flights === 0 ? 0 : 0.12 + 0.88 * b.intensity})` }}
                />
              ))}
            </div>
            <div className="mt-1 flex justify-between text-xs text-muted">
              <span>{quarterText(bins[0]!.startMs, timeZone)}</span>
              <span>{quarterText(bins[bins.length - 1]!.startMs, timeZone)} {timeZone}</span>
            </div>
          </div>
          <div className="sr-only">
              <table>
                <caption className="sr-only">Flights and lift by quarter hour ({timeZone})</caption>
                <thead>
                  <tr>
                    <th scope="col">Quarter hour</th>
                    <th scope="col">Flights</th>
                    <th scope="col">Lift (share of the best)</th>
                  </tr>
                </thead>
                <tbody>
                  {bins.filter((b) => b.flights > 0).map((b) => (
                    <tr key={b.startMs}>
                      <th scope="row">{quarterText(b.startMs, timeZone)}</th>
                      <td>{b.flights}</td>
                      <td>{Math.round(b.intensity * 100)} %</td>
                    </tr>
                  ))}
                </tbody>
              </table>
          </div>
        </>
      ) : null}
    </section>
  );
}
