"use client";

import { useCallback, useSyncExternalStore } from "react";

/**
 * A timekeeper's phone may time flights while the working-time signal is given on another
 * phone (a partner or the contest's start phone). The choice is kept per run on this device so
 * a reload keeps it; the server puts both phones' taps on one timeline with measured clock
 * offsets (SYNC.md §4) and scores them there.
 */
const key = (runId: string) => `windowcall.signal-elsewhere.${runId}`;
const listeners = new Set<() => void>();

function read(runId: string): boolean {
  try {
    return localStorage.getItem(key(runId)) === "1";
  } catch {
    return false;
  }
}

/** Whether this phone times flights for a signal given on another phone, and a setter. */
export function useSignalElsewhere(runId: string): [boolean, (on: boolean) => void] {
  const subscribe = useCallback((cb: () => void) => {
    listeners.add(cb);
    return () => listeners.delete(cb);
  }, []);
  const value = useSyncExternalStore(subscribe, () => read(runId), () => false);
  const set = useCallback(
    (on: boolean) => {
      try {
        if (on) localStorage.setItem(key(runId), "1");
        else localStorage.removeItem(key(runId));
      } catch {
        /* private mode: lasts for this page only */
      }
      listeners.forEach((l) => l());
    },
    [runId],
  );
  return [value, set];
}

/** The note shown while the signal belongs to another phone. */
export function SignalElsewhereNote({ onUndo }: { onUndo: () => void }) {
  return (
    <div role="status" className="space-y-2 rounded-xl border-4 border-ink p-3">
      <p className="font-bold">
        <span aria-hidden>⇄ </span>The start signal is given on another phone.
      </p>
      <p>
        Time the flights here. This phone cannot score them against a signal it has not seen: once both phones have synced,
        the official result, on one timeline, is in the logbook.
      </p>
      <button type="button" onClick={onUndo} className="min-h-12 font-bold underline">
        Give the signal on this phone instead
      </button>
    </div>
  );
}

/** The choice offered under the start control. */
export function SignalElsewhereButton({ onChoose }: { onChoose: () => void }) {
  return (
    <button type="button" onClick={onChoose} className="min-h-touch w-full rounded-xl border-2 border-ink font-bold">
      <span aria-hidden>⇄ </span>Signal given on another phone — time flights here
    </button>
  );
}
