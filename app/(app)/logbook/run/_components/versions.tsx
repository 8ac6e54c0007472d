import { secondsText } from "@/lib/field/display";
import type { StoredRun } from "@/lib/offline/db";

/**
 * The server's result per lane and every phone's version of it (SYNC.md §3: all versions stay
 * in the log), once a sync has pulled them. The rulings that do not count are shown with each
 * lane (RulingNotes, from the same result function). Until a sync this says so plainly.
 */
export function Versions({ run, deviceId }: { run: StoredRun; deviceId: string | null }) {
  const pilot = (lane: number) => run.lanes.find((l) => l.lane === lane)?.pilotName ?? `Lane ${lane + 1}`;
  if (!run.results || run.results.length === 0) {
    return (
      <p className="text-muted" data-testid="versions-pending">
        Only this phone’s record is shown. After a sync, the server’s result and each phone’s version of this run are listed here.
      </p>
    );
  }
  return (
    <ul className="space-y-3">
      {run.results.map((r) => (
        <li key={r.lane} className="rounded-lg border-2 border-line p-3">
          <p className="font-bold">
            {pilot(r.lane)}: <span className="figures">{r.resultTenths === null ? "no result yet" : `${secondsText(r.resultTenths)} s`}</span> on the server
            {r.penaltyPoints > 0 ? `, −${r.penaltyPoints} points` : ""}
          </p>
          {r.needsReview ? (
            <p className="font-semibold text-warn">
              <span aria-hidden="true">⚠ </span>For the officials to decide: {r.reviewReason ?? "the clocks cannot settle it"}
            </p>
          ) : null}
          <ul className="figures mt-1 text-sm">
            {r.versions.map((v) => (
              <li key={v.deviceId}>
                {v.chosen ? "● " : "○ "}
                {v.deviceId === deviceId ? "this phone" : `phone ${v.deviceId.slice(-6)}`}: {secondsText(v.resultTenths)} s
                {v.official ? " · official timekeeper" : ""}
                {v.chosen ? " · used" : ""}
              </li>
            ))}
          </ul>
        </li>
      ))}
    </ul>
  );
}
