"use client";

import { useEffect, useState } from "react";
import { dayLabel } from "@/lib/days/summary";
import { secondsText } from "@/lib/field/display";
import { formatClock } from "@/lib/format";

/** As GET /api/runs/[runId]/day-decisions answers (db/queries/run-day-decisions.ts RunDayDecision). */
export type RunDayDecision = {
  clubName: string; clubSlug: string | null; day: string; timeZone: string; lane: number; deviceId: string; recordedByName: string | null;
  boardResultTenths: number | null; runResultTenths: number | null; decidedByName: string | null; decidedAt: string; note: string;
};

/** The club days' decisions on this run the user may see; empty offline or before the answer. */
export function useRunDayDecisions(runId: string | null): RunDayDecision[] {
  const [decisions, setDecisions] = useState<RunDayDecision[]>([]);
  useEffect(() => {
    if (!runId) return;
    let live = true;
    fetch(`/api/runs/${runId}/day-decisions`, { cache: "no-store" })
      .then((res) => (res.ok ? (res.json() as Promise<{ decisions: RunDayDecision[] }>) : null))
      .then((body) => {
        if (live && body) setDecisions(body.decisions);
      })
      .catch(() => undefined); // offline: the run's own result only
    return () => {
      live = false;
    };
  }, [runId]);
  return decisions;
}

const result = (tenths: number | null) => (tenths === null ? "no result" : `${secondsText(tenths)} s`);

/**
 * Beside a lane's result: a club's field day counts another record for it (an officer's decision on its
 * Day board), so the pilot reads both numbers and why they differ. Day-scoped: this run's result stays.
 */
export function LaneDayDecisions({ decisions }: { decisions: readonly RunDayDecision[] }) {
  if (decisions.length === 0) return null;
  return (
    <ul className="space-y-2" aria-label="Club days that counted another record">
      {decisions.map((d) => (
        <li key={`${d.clubName}:${d.day}`} className="rounded-lg border-2 border-warn p-3 text-sm" data-testid="day-decision">
          <p className="font-bold">
            {d.clubName}, field day of {dayLabel(d.day)}: the Day board counts {d.recordedByName ? `${d.recordedByName}’s` : "another"} phone’s record (…{d.deviceId.slice(-6)}):{" "}
            <span className="figures">{result(d.boardResultTenths)}</span> there; this run’s result is <span className="figures">{result(d.runResultTenths)}</span>.
          </p>
          <p>
            Decided by {d.decidedByName ?? "an officer"} on {formatClock(new Date(d.decidedAt), d.timeZone)}
            {d.note ? `. Note: ${d.note}` : "."}
          </p>
          <p className="text-muted">The decision is the club’s for that day; the result here, in the logbook and the Season follows the conflict rules.</p>
          {d.clubSlug ? (
            <a className="font-bold underline" href={`/clubs/${d.clubSlug}/days/${d.day}`}>
              Open the Day board
            </a>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
