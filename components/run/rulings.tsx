import { secondsText } from "@/lib/field/display";
import { PENALTY_CAUSE_WORDS, REFLIGHT_CAUSE_WORDS, REFLIGHT_PLACEMENT_WORDS } from "@/lib/field/ruling-words";
import type { LaneScore } from "@/lib/tasks";

type Props = { lane: LaneScore; label: string };

const DROPPED = {
  "higher-in-same-attempt": "dropped: a higher penalty in the same flight counts instead (F3K.4.3)",
  "mid-air-collision": "dropped: caused by a mid-air collision (F3K.4.3)",
} as const;

/**
 * The lane's rulings as the engine applied them: each penalty applied or dropped with the
 * reason, a round scored zero and why, and any re-flight granted. Nothing when there are none.
 */
export function Rulings({ lane, label }: Props) {
  if (lane.penalties.length === 0 && lane.roundZero === null && lane.reflights.length === 0) return null;
  const flightOf = (launchId: string | undefined) => {
    const f = launchId ? lane.flights.find((x) => x.launchId === launchId) : undefined;
    return f ? ` · flight ${f.index + 1}` : "";
  };
  return (
    <section aria-label={`Rulings, ${label}`} className="space-y-2 rounded-lg border-2 border-line p-3">
      <h3 className="font-bold">Rulings</h3>
      {lane.roundZero ? (
        <p className="font-semibold text-danger" data-testid={`round-zero-${lane.lane}`}>
          The round scores zero:{" "}
          {lane.roundZero === "launch-contact" ? "contact with a person at launch (F3K.4.1)" : "the result was not signed by pilot and timekeeper (F3K.1.2)"}. Flown:{" "}
          {secondsText(lane.zeroedTenths)} s.
        </p>
      ) : null}
      {lane.penalties.length > 0 ? (
        <ul className="space-y-1" aria-label={`Penalties, ${label}`}>
          {lane.penalties.map((p) => (
            <li key={p.id} className={p.applied ? "" : "text-muted"}>
              <span className={p.applied ? "font-bold" : "line-through"}>−{p.points} points</span> · {p.cause ? PENALTY_CAUSE_WORDS[p.cause].label : p.reason}
              {p.cause && p.reason !== PENALTY_CAUSE_WORDS[p.cause].label ? ` (${p.reason})` : ""}
              {flightOf(p.launchId)} — {p.applied ? "applied" : DROPPED[p.dropped!]}
            </li>
          ))}
        </ul>
      ) : null}
      {lane.penalties.length > 0 ? <p className="text-sm">Penalty points that count: {lane.penaltyPoints}</p> : null}
      {lane.reflights.map((r) => (
        <p key={r.id} data-testid={`reflight-${lane.lane}`}>
          Re-flight granted for {REFLIGHT_CAUSE_WORDS[r.cause]}, flown {REFLIGHT_PLACEMENT_WORDS[r.placement].label}: {REFLIGHT_PLACEMENT_WORDS[r.placement].stands} (F3K.9.6)
          {r.reason ? `. ${r.reason}` : ""}.
        </p>
      ))}
    </section>
  );
}
