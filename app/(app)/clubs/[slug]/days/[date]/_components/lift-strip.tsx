import { describeLiftTimeline } from "@/lib/days/lift-sentence";
import type { LiftBin } from "@/lib/days/lift-timeline";
import { quarterText } from "./day-format";

/**
 * The lift timeline: one cell per quarter hour, darker where flights beat their pilots' own
 * medians by more. The strip is a picture for sighted readers; the sentence above it and the
 * table under it (for screen readers only) say the same in words.
 */
export function LiftStrip({ bins }: { bins: LiftBin[] }) {
  const sentence = describeLiftTimeline(bins, (ms) => `${quarterText(ms)} UTC`);
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
                  title={`${quarterText(b.startMs)}: ${b.flights} flights`}
                  className="h-10 min-w-0 flex-1 rounded-sm border border-line"
                  style={{ backgroundColor: `rgb(234 88 12 / ${b.flights === 0 ? 0 : 0.12 + 0.88 * b.intensity})` }}
                />
              ))}
            </div>
            <div className="mt-1 flex justify-between text-xs text-muted">
              <span>{quarterText(bins[0]!.startMs)}</span>
              <span>{quarterText(bins[bins.length - 1]!.startMs)} UTC</span>
            </div>
          </div>
          <div className="sr-only">
              <table>
                <caption className="sr-only">Flights and lift by quarter hour (UTC)</caption>
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
                      <th scope="row">{quarterText(b.startMs)}</th>
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
