"use client";

import type { ReactNode } from "react";
import { clockText, formatRunning, secondsText } from "@/lib/field/display";
import type { LaneLive } from "@/lib/tasks";

type Props = {
  lane: LaneLive;
  label: string;
  solo: boolean;
  /** ms since working-time start (for time on the ground), or null. */
  elapsedMs: number | null;
  strip: ReactNode;
  control: ReactNode;
  /** A note on the lane's record (a wall-clock jump), shown below the control so the control stays in reach. */
  note?: ReactNode;
  picker: ReactNode;
  tools: ReactNode;
  list: ReactNode;
};

/**
 * One pilot's lane: the current flight in large figures, the score lines, the warnings,
 * then the big control (within thumb reach without scrolling on a phone), then the strip.
 */
export function LanePanel({ lane, label, solo, elapsedMs, strip, control, note, picker, tools, list }: Props) {
  const inAir = lane.currentFlightMs !== null;
  const lastLanded = [...lane.flights].reverse().find((f) => f.landMs !== null);
  const groundMs = !inAir && lastLanded?.landMs != null && elapsedMs !== null ? Math.max(0, elapsedMs - lastLanded.landMs) : null;
  return (
    <section aria-label={label} className={`space-y-3 ${solo ? "" : "rounded-2xl border-2 border-line p-3"}`}>
      {solo ? null : <h2 className="text-lg font-extrabold">{label}</h2>}
      <div className="flex items-baseline justify-between gap-2">
        <p className="text-sm font-semibold uppercase tracking-wide text-muted">{inAir ? "In the air" : groundMs !== null ? "On the ground" : "Ready"}</p>
        <p className={`figures font-extrabold leading-none ${solo ? "text-6xl" : "text-5xl"}`} data-testid={`flight-clock-${lane.lane}`}>
          {inAir ? formatRunning(lane.currentFlightMs ?? 0) : groundMs !== null ? formatRunning(groundMs) : "0:00.0"}
        </p>
      </div>
      <dl className="grid grid-cols-3 gap-2 text-center">
        <Figure term="Result" value={secondsText(lane.resultTenths)} testId={`result-${lane.lane}`} />
        <Figure term="Best possible" value={secondsText(lane.bestPossibleTenths)} />
        <Figure term={lane.nextTargetSec !== null ? "Next target" : inAir ? "If it lands now" : "Launches left"} value={nextValue(lane, inAir)} />
      </dl>
      {lane.penaltyPoints > 0 ? <p className="font-bold">Penalty: −{lane.penaltyPoints} points</p> : null}
      {lane.warnings.length > 0 ? (
        <ul className="space-y-1">
          {lane.warnings.map((w) => (
            <li key={w.code} className="font-semibold text-warn">
              <span aria-hidden>⚠ </span>
              {w.message}
            </li>
          ))}
        </ul>
      ) : null}
      {picker}
      {control}
      {note}
      {strip}
      {lane.hints.length > 0 ? (
        <p className="figures text-sm font-semibold" data-testid={`hints-${lane.lane}`}>
          Next flight: {lane.hints.map((h) => `fly ${clockText(h.sec)} → +${secondsText(h.gainTenths)}`).join(" · ")}
        </p>
      ) : null}
      {tools}
      {list}
    </section>
  );
}

function nextValue(lane: LaneLive, inAir: boolean): string {
  if (lane.nextTargetSec !== null) return `${lane.nextTargetSec} s`;
  if (inAir) return secondsText(lane.ifLandedNowTenths);
  return lane.launchesLeft === null ? "any" : String(lane.launchesLeft);
}

function Figure({ term, value, testId }: { term: string; value: string; testId?: string }) {
  return (
    <div className="rounded-lg border-2 border-line px-1 py-2">
      <dt className="text-xs font-semibold text-muted">{term}</dt>
      <dd className="figures text-2xl font-bold" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}
