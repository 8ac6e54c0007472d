"use client";

import { useId, useState } from "react";
import { parseFlightTime } from "@/lib/field/flight-fix";
import { secondsText } from "@/lib/field/display";
import type { InvalidReason } from "./flight-list";

const REASONS: { value: InvalidReason; label: string }[] = [
  { value: "landing-outside-field", label: "Landed outside the field" },
  { value: "part-lost", label: "A part came off in flight" },
  { value: "forbidden-airspace", label: "Did not leave forbidden airspace" },
  { value: "other", label: "Other reason" },
];

type Props = {
  flightNumber: number;
  currentTenths: number | null;
  onSetTime: (tenths: number) => Promise<unknown>;
  onInvalid: (reason: InvalidReason) => Promise<unknown>;
};

/** Correct a landed flight's time or mark it invalid; both are new events, nothing is overwritten. */
export function FlightFix({ flightNumber, currentTenths, onSetTime, onInvalid }: Props) {
  const id = useId();
  const [text, setText] = useState(currentTenths === null ? "" : secondsText(currentTenths));
  const [reason, setReason] = useState<InvalidReason>("landing-outside-field");
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="mt-2 space-y-3 rounded-lg bg-surface p-3">
      <form
        className="flex items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          const tenths = parseFlightTime(text);
          if (tenths === null) return setError("Type the time as seconds (63.4) or minutes:seconds (1:03.4).");
          setError(null);
          void onSetTime(tenths);
        }}
      >
        <div className="flex-1">
          <label htmlFor={`${id}-t`} className="block text-sm font-semibold">
            Correct time of flight {flightNumber} (s)
          </label>
          <input
            id={`${id}-t`}
            inputMode="decimal"
            value={text}
            onChange={(e) => setText(e.target.value)}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-e` : undefined}
            className="figures min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2 text-lg"
          />
        </div>
        <button type="submit" className="min-h-12 rounded-lg bg-accent px-4 font-bold text-accent-ink">
          Set time
        </button>
      </form>
      {error ? (
        <p id={`${id}-e`} className="text-sm font-semibold text-danger">
          {error}
        </p>
      ) : null}
      <div className="flex items-end gap-2">
        <div className="flex-1">
          <label htmlFor={`${id}-r`} className="block text-sm font-semibold">
            Why flight {flightNumber} scores zero
          </label>
          <select
            id={`${id}-r`}
            value={reason}
            onChange={(e) => setReason(e.target.value as InvalidReason)}
            className="min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2"
          >
            {REASONS.map((r) => (
              <option key={r.value} value={r.value}>
                {r.label}
              </option>
            ))}
          </select>
        </div>
        <button type="button" onClick={() => void onInvalid(reason)} className="min-h-12 rounded-lg border-2 border-danger px-3 font-bold text-danger">
          Mark invalid
        </button>
      </div>
    </div>
  );
}
