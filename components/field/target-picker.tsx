"use client";

import { useId, useState } from "react";
import { useInstantPress } from "./use-instant-press";

const QUICK = [30, 40, 45, 50, 60, 75, 90, 120, 150, 180, 240, 300];

type Props = {
  laneLabel: string;
  /** Seconds of working time left, to grey out targets that no longer fit. */
  secondsLeft: number | null;
  allowEndCall: boolean;
  onTarget: (targetSec: number, timeStamp: number) => void;
  onEndCall: (timeStamp: number) => void;
};

/**
 * Task E: the pilot's announced target, picked before the launch (F3K.11.5). Shown only
 * while no target is pending: an unreached target cannot be changed.
 */
export function TargetPicker({ laneLabel, secondsLeft, allowEndCall, onTarget, onEndCall }: Props) {
  const id = useId();
  const [other, setOther] = useState("");
  const [error, setError] = useState<string | null>(null);
  return (
    <fieldset className="space-y-2 rounded-xl border-2 border-ink p-3">
      <legend className="px-1 font-bold">Announced target, {laneLabel}</legend>
      <div className="grid grid-cols-4 gap-2">
        {QUICK.map((s) => (
          <TargetButton key={s} seconds={s} tooLong={secondsLeft !== null && s > secondsLeft} onPress={(t) => onTarget(s, t)} />
        ))}
      </div>
      <form
        className="flex items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          const s = Number(other);
          if (!Number.isInteger(s) || s < 1 || s > 3600) return setError("A target is a whole number of seconds, 1 to 3600.");
          setError(null);
          onTarget(s, e.timeStamp);
          setOther("");
        }}
      >
        <div className="flex-1">
          <label htmlFor={`${id}-o`} className="block text-sm font-semibold">
            Other target (s)
          </label>
          <input id={`${id}-o`} inputMode="numeric" value={other} onChange={(e) => setOther(e.target.value)} className="figures min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2 text-lg" />
        </div>
        <button type="submit" className="min-h-12 rounded-lg border-2 border-ink px-4 font-bold">
          Call
        </button>
      </form>
      {error ? <p className="text-sm font-semibold text-danger">{error}</p> : null}
      {allowEndCall ? (
        <button type="button" onClick={(e) => onEndCall(e.timeStamp)} className="min-h-12 w-full rounded-lg border-2 border-ink font-bold">
          Call &ldquo;end of working time&rdquo; (one attempt)
        </button>
      ) : null}
    </fieldset>
  );
}

function TargetButton({ seconds, tooLong, onPress }: { seconds: number; tooLong: boolean; onPress: (timeStamp: number) => void }) {
  const press = useInstantPress(onPress);
  return (
    <button type="button" {...press} className={`figures min-h-touch rounded-lg border-2 border-ink text-xl font-bold ${tooLong ? "border-dashed" : ""}`}>
      {seconds}
      <span className="sr-only"> seconds{tooLong ? ", longer than the time left" : ""}</span>
    </button>
  );
}
