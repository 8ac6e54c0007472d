import { Breakdown, Rulings, TimelineStrip } from "@/components/run";
import { secondsText } from "@/lib/field/display";
import type { RunLane } from "@/lib/events/entities";
import type { PhoneResult } from "@/lib/offline/run-result";
import { pointsLost, type TaskDefinition } from "@/lib/tasks";
import { ClockNote } from "@/components/run";

type Props = { runId: string; task: TaskDefinition; result: PhoneResult; lanes: readonly RunLane[] };

/** The closed window: each pilot's result, what was possible, and the way to the full review. */
export function RunSummary({ runId, task, result, lanes }: Props) {
  const { folded } = result;
  return (
    <section aria-labelledby="summary-title" className="space-y-4">
      <h2 id="summary-title" className="text-2xl font-extrabold">
        Window closed
      </h2>
      <ul className="space-y-3">
        {lanes.map((l) => {
          const lane = folded.lanes[l.lane];
          if (!lane) return null;
          const lost = pointsLost(task, lane);
          return (
            <li key={l.lane} className="card rounded-xl border border-line bg-raised p-4" aria-label={`Result, ${l.pilotName}`}>
              <p className="font-bold">{l.pilotName}</p>
              <p className="figures text-5xl font-extrabold" data-testid={`final-result-${l.lane}`}>
                {secondsText(lane.resultTenths)} s
              </p>
              <p className="figures text-muted">
                of {secondsText(lost.maxTenths)} s possible · {secondsText(lost.lostTenths)} s lost
                {lane.penaltyPoints > 0 ? ` · penalty −${lane.penaltyPoints} points` : ""}
              </p>
              <ClockNote derivation={result.lanes.find((d) => d.lane === l.lane)} />
              <div className="mt-3 space-y-3">
                <TimelineStrip definition={task} flights={lane.flights} label={l.pilotName} />
                <Rulings lane={lane} label={l.pilotName} />
                <Breakdown definition={task} lane={lane} />
              </div>
            </li>
          );
        })}
      </ul>
      <a href={`/logbook/run?id=${runId}`} className="flex min-h-touch items-center justify-center rounded-xl border-2 border-ink font-bold">
        Full review in the logbook →
      </a>
      <a href="/field" className="flex min-h-touch items-center justify-center rounded-xl bg-accent font-bold text-accent-ink">
        Back to the field
      </a>
    </section>
  );
}
