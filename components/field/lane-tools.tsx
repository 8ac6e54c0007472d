"use client";

import { useId, useState } from "react";

type Props = {
  laneLabel: string;
  canUndo: boolean;
  undoWhat: string | null;
  onUndo: () => void;
  onPenalty: (points: number, reason: string) => Promise<boolean>;
};

/** Undo the lane's last tap, and add a penalty (points + reason): each a new event. */
export function LaneTools({ laneLabel, canUndo, undoWhat, onUndo, onPenalty }: Props) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const [points, setPoints] = useState("100");
  const [reason, setReason] = useState("");
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="space-y-2">
      <div className="grid grid-cols-2 gap-2">
        <button type="button" disabled={!canUndo} onClick={onUndo} className="min-h-touch rounded-xl border-2 border-ink font-bold disabled:opacity-50">
          ↶ Undo {undoWhat ?? "last tap"}
          <span className="sr-only">, {laneLabel}</span>
        </button>
        <button type="button" aria-expanded={open} onClick={() => setOpen(!open)} className="min-h-touch rounded-xl border-2 border-ink font-bold">
          Penalty…<span className="sr-only"> {laneLabel}</span>
        </button>
      </div>
      {open ? (
        <form
          className="space-y-2 rounded-lg bg-surface p-3"
          onSubmit={async (e) => {
            e.preventDefault();
            const p = Number(points);
            if (!Number.isInteger(p) || p < 1 || p > 1000) return setError("Points are a whole number from 1 to 1000.");
            if (!reason.trim()) return setError("Say why (e.g. touched an object in the safety area).");
            setError(null);
            if (await onPenalty(p, reason.trim())) {
              setOpen(false);
              setReason("");
            }
          }}
        >
          <div className="flex gap-2">
            <div className="w-24">
              <label htmlFor={`${id}-p`} className="block text-sm font-semibold">
                Points
              </label>
              <input id={`${id}-p`} inputMode="numeric" value={points} onChange={(e) => setPoints(e.target.value)} className="figures min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2 text-lg" />
            </div>
            <div className="flex-1">
              <label htmlFor={`${id}-r`} className="block text-sm font-semibold">
                Reason
              </label>
              <input id={`${id}-r`} value={reason} maxLength={200} onChange={(e) => setReason(e.target.value)} className="min-h-12 w-full rounded-lg border-2 border-line bg-raised px-2" />
            </div>
          </div>
          {error ? <p className="text-sm font-semibold text-danger">{error}</p> : null}
          <button type="submit" className="min-h-12 w-full rounded-lg border-2 border-danger font-bold text-danger">
            Add penalty
          </button>
        </form>
      ) : null}
    </div>
  );
}
