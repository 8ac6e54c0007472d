import type { ModelStats } from "@/lib/hangar/stats";
import { secondsText } from "@/lib/field/display";

const m = (v: number | null) => (v === null ? "—" : `${v.toFixed(1)} m`);
const day = (ms: number | null) => (ms === null ? "never" : new Date(ms).toISOString().slice(0, 10));

/** The model's record: what a pilot weighs before choosing it for a contest. */
export function ModelRecord({ stats, repairs, heights }: { stats: ModelStats; repairs: number; heights: { atMs: number; heightM: number }[] }) {
  return (
    <section aria-labelledby="record-h" className="space-y-2">
      <h2 id="record-h" className="text-lg font-bold">Record</h2>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1">
        <dt>Flights</dt><dd className="figures" data-testid="model-flights">{stats.flights}</dd>
        <dt>Launches measured</dt><dd className="figures">{stats.launches}</dd>
        <dt>Median launch</dt><dd className="figures" data-testid="model-median-launch">{m(stats.medianLaunchM)}</dd>
        <dt>Best launch</dt><dd className="figures" data-testid="model-best-launch">{m(stats.bestLaunchM)}</dd>
        <dt>Median turnaround</dt><dd className="figures">{stats.medianTurnaroundMs === null ? "—" : `${Math.round(stats.medianTurnaroundMs / 1000)} s`}</dd>
        <dt>Last flown</dt><dd className="figures">{day(stats.lastFlownMs)}</dd>
        <dt>Repairs</dt><dd className="figures">{repairs}</dd>
      </dl>
      {stats.medianTimeByTask.length ? (
        <ul className="text-sm" aria-label="Median flight time per task">
          {stats.medianTimeByTask.map((t) => <li key={t.taskCode}>Task {t.taskCode}: median {secondsText(t.medianTenths)} s over {t.flights} flights</li>)}
        </ul>
      ) : null}
      {heights.length ? (
        <>
          <h3 className="font-bold">Latest launch heights</h3>
          <ul aria-label="Latest launch heights" className="figures text-sm">
            {heights.map((h) => <li key={h.atMs}>{new Date(h.atMs).toISOString().slice(0, 16).replace("T", " ")} UTC — {h.heightM.toFixed(1)} m</li>)}
          </ul>
        </>
      ) : null}
    </section>
  );
}
