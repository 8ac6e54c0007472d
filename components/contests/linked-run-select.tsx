"use client";

import type { LinkableLane } from "@/lib/contests/linkable";
import { formatClock } from "@/lib/format";
import { formatTenths } from "@/lib/tasks";

/** A lane's value in the select: "runId#lane"; "" is the paper card. */
export const laneValue = (l: { runId: string; lane: number }) => `${l.runId}#${l.lane}`;

/**
 * "Timed run of …": the runs a timekeeper's phone timed and synced that the officer can link to a
 * pilot's result (db/queries/contest-lanes.ts), each as its start on the club's clock, lane, pilot
 * and server result; the run linked now stays offered when it is no longer among them.
 */
export function LinkedRunSelect(p: {
  label: string; lanes: readonly LinkableLane[]; linked: { runId: string; lane: number } | null;
  value: string; onChange: (value: string) => void; timeZone: string; className: string;
}) {
  const linked = p.linked;
  return (
    <label className="block">{p.label}
      <select className={p.className} value={p.value} onChange={(e) => p.onChange(e.target.value)}>
        <option value="">None (paper card)</option>
        {linked && !p.lanes.some((l) => l.runId === linked.runId && l.lane === linked.lane) && <option value={laneValue(linked)}>The linked run</option>}
        {p.lanes.map((l) => (
          <option key={laneValue(l)} value={laneValue(l)}>
            {formatClock(new Date(l.startedAt), p.timeZone, "time")} · lane {l.lane + 1} · {l.pilotName} · {l.resultTenths === null ? "no result" : formatTenths(l.resultTenths)}
          </option>
        ))}
      </select>
    </label>
  );
}
