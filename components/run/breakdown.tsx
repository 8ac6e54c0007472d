import { secondsText } from "@/lib/field/display";
import { Swatch, type SwatchKind } from "./swatch";
import { pointsLost, type LaneScore, type PointsLost, type TaskDefinition } from "@/lib/tasks";

type Props = { definition: TaskDefinition; lane: LaneScore };

const PARTS: { key: keyof PointsLost["parts"]; label: string; mark: SwatchKind }[] = [
  { key: "groundTime", label: "Time on the ground", mark: "ground" },
  { key: "overCap", label: "Flown beyond the cap or target", mark: "capped" },
  { key: "shortOfTarget", label: "Short of the cap or target", mark: "short" },
  { key: "notCounted", label: "Flights that did not count", mark: "pale" },
  { key: "invalid", label: "Flights that scored zero", mark: "zero" },
  { key: "roundZero", label: "Round scored zero by a ruling", mark: "zero" },
];

/**
 * Where the points went: the task's maximum, the result, and the difference split into
 * causes that add up exactly (lib/tasks pointsLost, integer tenths) — the sum is shown.
 * Penalties are contest points, listed beside the seconds, not inside them.
 */
export function Breakdown({ definition, lane }: Props) {
  const lost = pointsLost(definition, lane);
  const sum = PARTS.reduce((a, p) => a + lost.parts[p.key], 0);
  return (
    <section className="space-y-2" aria-label="Where the points went">
      <dl className="figures grid grid-cols-[1fr_auto] gap-x-4 gap-y-1">
        <dt>Most this task can score</dt>
        <dd className="text-right" data-testid="breakdown-max">{secondsText(lost.maxTenths)} s</dd>
        <dt>Scored</dt>
        <dd className="text-right font-bold" data-testid="breakdown-scored">{secondsText(lost.scoredTenths)} s</dd>
        <dt className="font-bold">Lost</dt>
        <dd className="text-right font-bold" data-testid="breakdown-lost">{secondsText(lost.lostTenths)} s</dd>
      </dl>
      <table className="figures w-full text-sm">
        <caption className="sr-only">Lost time by cause</caption>
        <tbody>
          {PARTS.map((p) => {
            const v = lost.parts[p.key];
            const share = lost.lostTenths > 0 ? (v / lost.lostTenths) * 100 : 0;
            return (
              <tr key={p.key} className={v === 0 ? "text-muted" : ""} data-part={p.key}>
                <th scope="row" className="py-1 text-left font-normal">
                  <Swatch kind={p.mark} />{" "}
                  {p.label}
                  <span className="mt-0.5 block h-1.5 bg-line/40" aria-hidden="true">
                    <span className="block h-1.5 bg-ink" style={{ width: `${share}%` }} />
                  </span>
                </th>
                <td className="py-1 pl-3 text-right align-top">{secondsText(v)} s</td>
              </tr>
            );
          })}
          <tr className="border-t-2 border-line font-bold">
            <th scope="row" className="py-1 text-left">Sum of the causes</th>
            <td className="py-1 pl-3 text-right" data-testid="breakdown-sum">
              {secondsText(sum)} s {sum === lost.lostTenths ? "= lost" : "≠ lost"}
            </td>
          </tr>
        </tbody>
      </table>
      {lost.penaltyPoints > 0 ? (
        <p className="font-semibold text-danger" data-testid="breakdown-penalty">
          <span aria-hidden="true">⚑ </span>Penalties: −{lost.penaltyPoints} points (taken from the round score, not the seconds)
        </p>
      ) : null}
      <p className="text-xs text-muted">
        {lost.windowBound
          ? "In this task the working time is the limit: every tenth on the ground costs a tenth of result, less the one second per scored flight the rules allow (F3K.7)."
          : "In this task each counted flight has its own maximum: time is lost flight by flight, short of the maximum."}
      </p>
    </section>
  );
}
