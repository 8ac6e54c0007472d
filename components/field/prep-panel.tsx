"use client";

import { formatCountdown } from "@/lib/field/display";
import type { PrepStage } from "@/lib/field/prep-plan";
import { useInstantPress } from "./use-instant-press";

type Props = {
  stage: PrepStage | null;
  onStart: (timeStamp: number) => void;
};

/**
 * Before the working time: the preparation countdown and the no-fly minute (F3K.9), then
 * the start. With no countdown, one large "Start working time" control is the signal.
 */
export function PrepPanel({ stage, onStart }: Props) {
  const counting = stage && stage.stage !== "due";
  const press = useInstantPress(onStart);
  return (
    <section aria-label="Before the working time" className="space-y-4">
      {counting ? (
        <div className="text-center">
          <p className="font-bold uppercase tracking-wide">{stage.stage === "preparation" ? "Preparation" : "No-fly minute — do not launch"}</p>
          <p className="figures text-[6.5rem] font-extrabold leading-none" data-testid="prep-left">
            {formatCountdown(stage.leftMs)}
          </p>
          <p className="text-muted">The working time starts by itself at zero.</p>
        </div>
      ) : (
        <p className="text-lg">Give the start signal when the working time begins. Launches before it score zero (F3K.6).</p>
      )}
      <button
        type="button"
        {...press}
        className={`w-full rounded-2xl border-4 border-ink bg-accent text-3xl font-extrabold text-accent-ink ${counting ? "min-h-touch" : "min-h-[30vh]"}`}
      >
        {counting ? "Start working time now" : "Start working time"}
      </button>
    </section>
  );
}
