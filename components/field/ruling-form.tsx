"use client";

import { useId, useState } from "react";
import { PENALTY_CAUSES, REFLIGHT_CAUSES, REFLIGHT_PLACEMENTS, type PenaltyCause, type ReflightCause, type ReflightPlacement } from "@/lib/events/schema";
import { PENALTY_CAUSE_WORDS, REFLIGHT_CAUSE_WORDS, REFLIGHT_PLACEMENT_WORDS } from "@/lib/field/ruling-words";

export type PenaltyInput = { points: number; reason: string; cause: PenaltyCause; launchId?: string; midAir?: boolean };
export type RulingActions = {
  onPenalty: (p: PenaltyInput) => Promise<boolean>;
  onUnsigned: () => Promise<boolean>;
  onReflight: (cause: ReflightCause, placement: ReflightPlacement) => Promise<boolean>;
};
type Props = RulingActions & { laneLabel: string; flights: readonly { index: number; launchId: string }[]; onDone: () => void };

const field = "min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2";

/** A penalty (what happened, in which flight, mid-air or not), "not signed", or a re-flight: each one new event. */
export function RulingForm({ laneLabel, flights, onPenalty, onUnsigned, onReflight, onDone }: Props) {
  const id = useId();
  const last = flights[flights.length - 1];
  const [cause, setCause] = useState<PenaltyCause>("object-in-safety-area");
  const [points, setPoints] = useState("100");
  const [launchId, setLaunchId] = useState(last?.launchId ?? "");
  const [midAir, setMidAir] = useState(false);
  const [reason, setReason] = useState("");
  const [rCause, setRCause] = useState<ReflightCause>("organiser");
  const [placement, setPlacement] = useState<ReflightPlacement>("later-group");
  const [error, setError] = useState<string | null>(null);
  const pickCause = (c: PenaltyCause) => {
    setCause(c);
    const preset = PENALTY_CAUSE_WORDS[c].points;
    if (preset !== null) setPoints(String(preset));
  };
  return (
    <div className="space-y-3 rounded-lg bg-surface p-3">
      <form
        className="space-y-2"
        aria-label={`Penalty, ${laneLabel}`}
        onSubmit={async (e) => {
          e.preventDefault();
          const p = Number(points);
          if (!Number.isInteger(p) || p < 1 || p > 1000) return setError("Points are a whole number from 1 to 1000.");
          const words = reason.trim() || (cause === "other" ? "" : PENALTY_CAUSE_WORDS[cause].label);
          if (!words) return setError("Say what happened.");
          setError(null);
          if (await onPenalty({ points: p, reason: words.slice(0, 200), cause, ...(launchId ? { launchId } : {}), ...(midAir ? { midAir } : {}) })) onDone();
        }}
      >
        <label htmlFor={`${id}-c`} className="block text-sm font-semibold">What happened</label>
        <select id={`${id}-c`} value={cause} onChange={(e) => pickCause(e.target.value as PenaltyCause)} className={field}>
          {PENALTY_CAUSES.map((c) => (
            <option key={c} value={c}>{PENALTY_CAUSE_WORDS[c].label}</option>
          ))}
        </select>
        <div className="flex gap-2">
          <div className="w-24">
            <label htmlFor={`${id}-p`} className="block text-sm font-semibold">Points</label>
            <input id={`${id}-p`} inputMode="numeric" value={points} onChange={(e) => setPoints(e.target.value)} className={`figures text-lg ${field}`} />
          </div>
          <div className="flex-1">
            <label htmlFor={`${id}-f`} className="block text-sm font-semibold">In which flight</label>
            <select id={`${id}-f`} value={launchId} onChange={(e) => setLaunchId(e.target.value)} className={field}>
              {flights.map((f) => (
                <option key={f.launchId} value={f.launchId}>Flight {f.index + 1}</option>
              ))}
              <option value="">Not during a flight</option>
            </select>
          </div>
        </div>
        <label className="flex min-h-12 items-center gap-3">
          <input type="checkbox" checked={midAir} onChange={(e) => setMidAir(e.target.checked)} className="h-6 w-6" />
          <span>Caused by a mid-air collision (no penalty, F3K.4.3)</span>
        </label>
        <label htmlFor={`${id}-r`} className="block text-sm font-semibold">Details (optional)</label>
        <input id={`${id}-r`} value={reason} maxLength={200} onChange={(e) => setReason(e.target.value)} className={field} />
        {error ? <p className="text-sm font-semibold text-danger">{error}</p> : null}
        <button type="submit" className="min-h-12 w-full rounded-lg border-2 border-danger font-bold text-danger">Add penalty</button>
      </form>
      <button type="button" onClick={async () => (await onUnsigned()) && onDone()} className="min-h-12 w-full rounded-lg border-2 border-danger font-bold text-danger">
        Result not signed: round scores zero<span className="sr-only">, {laneLabel}</span>
      </button>
      <form
        className="space-y-2"
        aria-label={`Re-flight, ${laneLabel}`}
        onSubmit={async (e) => {
          e.preventDefault();
          if (await onReflight(rCause, placement)) onDone();
        }}
      >
        <label htmlFor={`${id}-rc`} className="block text-sm font-semibold">Re-flight because of</label>
        <select id={`${id}-rc`} value={rCause} onChange={(e) => setRCause(e.target.value as ReflightCause)} className={field}>
          {REFLIGHT_CAUSES.map((c) => (
            <option key={c} value={c}>{REFLIGHT_CAUSE_WORDS[c]}</option>
          ))}
        </select>
        <label htmlFor={`${id}-rp`} className="block text-sm font-semibold">Flown</label>
        <select id={`${id}-rp`} value={placement} onChange={(e) => setPlacement(e.target.value as ReflightPlacement)} className={field}>
          {REFLIGHT_PLACEMENTS.map((p) => (
            <option key={p} value={p}>{REFLIGHT_PLACEMENT_WORDS[p].label}</option>
          ))}
        </select>
        <button type="submit" className="min-h-12 w-full rounded-lg border-2 border-ink font-bold">Grant a re-flight</button>
      </form>
    </div>
  );
}
