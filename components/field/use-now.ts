"use client";

import { useEffect, useState } from "react";
import { browserTimeSource, type TimeSource } from "@/lib/field/time-source";

export type Now = { wall: number; mono: number };

/**
 * "Now" for the live screen, re-read every animation frame. Only the clocks are read here:
 * everything shown is computed from the stored anchors and this value, so it cannot drift.
 */
export function useNow(source: TimeSource = browserTimeSource, running = true): Now {
  const [now, setNow] = useState<Now>(() => ({ wall: source.wallNow(), mono: source.monoNow() }));
  useEffect(() => {
    if (!running) return;
    let frame = 0;
    const tick = () => {
      setNow({ wall: source.wallNow(), mono: source.monoNow() });
      frame = requestAnimationFrame(tick);
    };
    frame = requestAnimationFrame(tick);
    // rAF stops in a hidden tab; re-read on return so the screen is right at once.
    const onVisible = () => setNow({ wall: source.wallNow(), mono: source.monoNow() });
    document.addEventListener("visibilitychange", onVisible);
    return () => {
      cancelAnimationFrame(frame);
      document.removeEventListener("visibilitychange", onVisible);
    };
  }, [source, running]);
  return now;
}
