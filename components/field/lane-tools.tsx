"use client";

import { useState } from "react";
import { RulingForm, type RulingActions } from "./ruling-form";

type Props = RulingActions & {
  laneLabel: string;
  canUndo: boolean;
  undoWhat: string | null;
  onUndo: () => void;
  flights: readonly { index: number; launchId: string }[];
};

/** Undo the lane's last tap, and rulings (penalty, not signed, re-flight): each a new event. */
export function LaneTools({ laneLabel, canUndo, undoWhat, onUndo, flights, ...rulings }: Props) {
  const [open, setOpen] = useState(false);
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
      {open ? <RulingForm laneLabel={laneLabel} flights={flights} {...rulings} onDone={() => setOpen(false)} /> : null}
    </div>
  );
}
