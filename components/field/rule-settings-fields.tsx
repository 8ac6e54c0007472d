"use client";

import { useId } from "react";
import { END_CALL_LABEL, HALVES_LABEL, type RuleSettings } from "@/lib/tasks";

type Props = { value: RuleSettings; onChange: (next: RuleSettings) => void; showEndCall: boolean };

/**
 * The choices the rules leave open, stored with the run's task so the run scores the same on
 * every screen (lib/tasks/rule-settings.ts). Defaults are ours where the rulebook is silent.
 */
export function RuleSettingsFields({ value, onChange, showEndCall }: Props) {
  const id = useId();
  return (
    <details className="rounded-xl border-2 border-line p-3">
      <summary className="min-h-12 cursor-pointer py-3 font-bold">Scoring choices the rules leave open</summary>
      <div className="space-y-3">
        <Choice
          id={`${id}-h`}
          label="Normalised score: an exact half of 0.1 point"
          labels={HALVES_LABEL}
          value={value.halves}
          onChange={(halves) => onChange({ ...value, halves })}
        />
        {showEndCall ? (
          <Choice
            id={`${id}-e`}
            label="Task E: the “end of working time” call credits"
            labels={END_CALL_LABEL}
            value={value.endCall}
            onChange={(endCall) => onChange({ ...value, endCall })}
          />
        ) : null}
        <p className="text-sm text-muted">The rulebook does not settle these; the first choice is ours. They are kept with this window.</p>
      </div>
    </details>
  );
}

/** One labelled choice among `labels` (value → words). */
function Choice<K extends string>({ id, label, labels, value, onChange }: { id: string; label: string; labels: Record<K, string>; value: K; onChange: (next: K) => void }) {
  return (
    <div>
      <label htmlFor={id} className="block font-semibold">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value as K)} className="min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2">
        {(Object.entries(labels) as [K, string][]).map(([k, words]) => (
          <option key={k} value={k}>
            {words}
          </option>
        ))}
      </select>
    </div>
  );
}
