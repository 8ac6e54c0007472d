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
        <div>
          <label htmlFor={`${id}-h`} className="block font-semibold">
            Normalised score: an exact half of 0.1 point
          </label>
          <select
            id={`${id}-h`}
            value={value.halves}
            onChange={(e) => onChange({ ...value, halves: e.target.value as RuleSettings["halves"] })}
            className="min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2"
          >
            {Object.entries(HALVES_LABEL).map(([k, label]) => (
              <option key={k} value={k}>
                {label}
              </option>
            ))}
          </select>
        </div>
        {showEndCall ? (
          <div>
            <label htmlFor={`${id}-e`} className="block font-semibold">
              Task E: the &ldquo;end of working time&rdquo; call credits
            </label>
            <select
              id={`${id}-e`}
              value={value.endCall}
              onChange={(e) => onChange({ ...value, endCall: e.target.value as RuleSettings["endCall"] })}
              className="min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2"
            >
              {Object.entries(END_CALL_LABEL).map(([k, label]) => (
                <option key={k} value={k}>
                  {label}
                </option>
              ))}
            </select>
          </div>
        ) : null}
        <p className="text-sm text-muted">The rulebook does not settle these; the first choice is ours. They are kept with this window.</p>
      </div>
    </details>
  );
}
