"use client";

import { useInstantPress } from "./use-instant-press";

/**
 * Task C (all up, last down): each attempt has its own launch signal (F3K.11.3). When one attempt
 * is over and more are due, the timekeeper gives the next signal here, stamped on touch.
 */
export function NextAttemptControl({ attempt, of, onSignal }: { attempt: number; of: number; onSignal: (timeStamp: number) => void }) {
  const press = useInstantPress(onSignal);
  return (
    <button type="button" {...press} className="min-h-[20vh] w-full rounded-2xl border-4 border-ink bg-accent text-3xl font-extrabold text-accent-ink">
      Launch signal, attempt {attempt} of {of}
    </button>
  );
}
