"use client";

import { useState } from "react";
import { creditedTargetText, reasonText, secondsText, STATUS_MARK } from "@/lib/field/display";
import type { InvalidReason } from "@/lib/events/schema";
import type { LiveFlight } from "@/lib/tasks";
import { FlightFix } from "./flight-fix";

type Props = {
  flights: LiveFlight[];
  laneLabel: string;
  onSetTime: (flightIndex: number, tenths: number) => Promise<boolean>;
  /** Resolves to why the launch could not move, or null once stored. */
  onSetLaunch: (flightIndex: number, tenths: number) => Promise<string | null>;
  /** Marks the flight launched by event `flightId` invalid. */
  onInvalid: (flightId: string, reason: InvalidReason) => Promise<boolean>;
};

/** The lane's flights, newest first: time, what it adds, and its status as a word and a shape. */
export function FlightList({ flights, laneLabel, onSetTime, onSetLaunch, onInvalid }: Props) {
  const [fixing, setFixing] = useState<number | null>(null);
  if (flights.length === 0) return <p className="text-muted">No flights yet.</p>;
  return (
    <ol aria-label={`Flights, ${laneLabel}`} className="divide-y-2 divide-line rounded-xl border-2 border-line">
      {[...flights].reverse().map((f) => {
        const mark = STATUS_MARK[f.status];
        const raw = f.landMs === null ? null : f.airTenths;
        const why = f.status === "counted" || f.status === "open" ? null : reasonText(f.reason);
        return (
          <li key={f.index} className="px-3 py-2">
            <div className="flex items-baseline gap-3">
              <span className="figures w-8 text-muted">#{f.index + 1}</span>
              <span className="figures text-xl font-bold">{raw === null ? "…" : `${secondsText(raw)} s`}</span>
              <span className="flex-1 text-sm">
                <span aria-hidden>{mark.symbol} </span>
                {mark.label}
                {f.status !== "open" && f.creditedTenths > 0 ? ` · +${secondsText(f.creditedTenths)}` : ""}
                {creditedTargetText(f) ? ` · ${creditedTargetText(f)}` : ""}
                {why ? <span className="block text-muted">{why}</span> : null}
              </span>
              {f.status !== "open" ? (
                <button
                  type="button"
                  className="min-h-12 rounded-lg border-2 border-ink px-3 text-sm font-bold"
                  aria-expanded={fixing === f.index}
                  onClick={() => setFixing(fixing === f.index ? null : f.index)}
                >
                  Fix<span className="sr-only"> flight {f.index + 1}</span>
                </button>
              ) : null}
            </div>
            {fixing === f.index ? (
              <FlightFix
                flightNumber={f.index + 1}
                currentTenths={raw}
                launchTenths={Math.floor(f.launchMs / 100)}
                onSetTime={async (t) => (await onSetTime(f.index, t)) && setFixing(null)}
                onSetLaunch={async (t) => {
                  const refused = await onSetLaunch(f.index, t);
                  if (refused === null) setFixing(null);
                  return refused;
                }}
                onInvalid={async (r) => (await onInvalid(f.launchId, r)) && setFixing(null)}
              />
            ) : null}
          </li>
        );
      })}
    </ol>
  );
}
