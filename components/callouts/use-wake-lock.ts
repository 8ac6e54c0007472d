"use client";

import { useEffect, useState, useSyncExternalStore } from "react";

export type WakeLockState = {
  /** The Screen Wake Lock API exists in this browser (null until known, on the client). */
  supported: boolean | null;
  /** The screen is being kept awake right now. */
  held: boolean;
  /** Why a request failed (e.g. battery saver), or null. */
  error: string | null;
};

/**
 * Keeps the screen awake while `active` (Screen Wake Lock API). The browser drops the lock
 * whenever the page is hidden, so it is taken again on `visibilitychange` when the page
 * comes back; it is released when `active` turns false or the component unmounts.
 */
export function useWakeLock(active: boolean): WakeLockState {
  const supported = useSyncExternalStore(noSubscription, hasWakeLock, () => null);
  const [lock, setLock] = useState<Omit<WakeLockState, "supported">>({ held: false, error: null });

  useEffect(() => {
    const api = hasWakeLock() ? navigator.wakeLock : null;
    if (!api || !active) return;
    let sentinel: WakeLockSentinel | null = null;
    let stopped = false;

    const take = async () => {
      if (stopped || document.visibilityState !== "visible" || (sentinel && !sentinel.released)) return;
      try {
        const lock = await api.request("screen");
        if (stopped) {
          void lock.release();
          return;
        }
        sentinel = lock;
        setLock({ held: true, error: null });
        lock.addEventListener("release", () => setLock((s) => ({ ...s, held: false })));
      } catch (e) {
        setLock({ held: false, error: e instanceof Error ? e.message : "The screen could not be kept awake." });
      }
    };
    const onVisibility = () => void take();

    void take();
    document.addEventListener("visibilitychange", onVisibility);
    return () => {
      stopped = true;
      document.removeEventListener("visibilitychange", onVisibility);
      if (sentinel && !sentinel.released) void sentinel.release();
      setLock((s) => ({ ...s, held: false }));
    };
  }, [active]);

  return { supported, ...lock };
}

function hasWakeLock(): boolean {
  return typeof navigator !== "undefined" && "wakeLock" in navigator;
}

function noSubscription(): () => void {
  return () => {};
}
