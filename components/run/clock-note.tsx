import { describeClockFlags, type LaneDerivation } from "@/lib/results";

/**
 * A lane whose phone saw its wall clock jump during the run: both times, the steady clock's
 * used, for the pilot or an official to decide (lib/results/clock-flags.ts).
 */
export function ClockNote({ derivation }: { derivation: LaneDerivation | undefined }) {
  const text = describeClockFlags(derivation?.derived.clock ?? []);
  if (!text) return null;
  return (
    <p role="note" className="rounded-lg border-2 border-warn p-2 font-semibold text-warn" data-testid={`clock-note-${derivation!.lane}`}>
      <span aria-hidden="true">⚠ </span>
      {text}
    </p>
  );
}
