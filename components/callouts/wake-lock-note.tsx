"use client";

import type { WakeLockState } from "./use-wake-lock";

/** A visible note when the screen cannot be kept awake; nothing while it can. */
export function WakeLockNote({ state }: { state: WakeLockState }) {
  if (state.supported === null || (state.supported && !state.error)) return null;
  return (
    <p role="note" className="rounded-lg border-2 border-warn bg-raised px-3 py-2 text-sm font-semibold text-warn">
      <span aria-hidden="true">◐ </span>
      {state.supported
        ? `The screen may go dark: ${state.error}. Tap the screen now and then, or lengthen the screen timeout.`
        : "This browser cannot keep the screen awake. Lengthen the phone's screen timeout for the window."}
    </p>
  );
}
