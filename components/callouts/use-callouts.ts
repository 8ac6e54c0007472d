"use client";

import { useEffect, useRef, useState } from "react";
import { calloutsDue, freshCallouts, selectCallouts, type Callout, type CalloutOptions } from "@/lib/callouts";
import type { LiveState, TaskDefinition } from "@/lib/tasks";
import { playCallouts, type PlayedAs } from "./player";
import { useCalloutSettings } from "./settings-store";
import { speechSupported, useLocalVoices } from "./speech";
import { unlockAudio } from "./tones";

export type UseCalloutsOptions = CalloutOptions & {
  /** Identifies the run: when it changes, the memory of what was said starts afresh. */
  runKey?: string;
};

export type CalloutsView = {
  /** The last callout played (for a visible caption), or null. */
  last: Callout | null;
  /** How it was played. */
  playedAs: PlayedAs | null;
  /** A local voice exists, so "voice" output can work offline. */
  voiceAvailable: boolean;
};

/**
 * Plays the run's callouts. Call it on every frame of the field screen with the live state
 * computed at `nowMs` (the run's timeline). Each callout is said at most once (by id); the
 * first frame only sets the starting point, so a reload mid-window does not replay the
 * past, and callouts more than 1.5 s late (a hidden page) are skipped.
 */
export function useCallouts(definition: TaskDefinition | null, live: LiveState | null, nowMs: number, options: UseCalloutsOptions = {}): CalloutsView {
  const [settings] = useCalloutSettings();
  const voices = useLocalVoices();
  const prevRef = useRef<number | null>(null);
  const saidRef = useRef(new Set<string>());
  const keyRef = useRef(options.runKey);
  const optionsRef = useRef(options);
  const [view, setView] = useState<Omit<CalloutsView, "voiceAvailable">>({ last: null, playedAs: null });

  useAudioUnlock();
  // Kept in a ref (updated before the playing effect runs) so a fresh options object each
  // frame does not count as a change.
  useEffect(() => {
    optionsRef.current = options;
  });

  useEffect(() => {
    if (keyRef.current !== optionsRef.current.runKey) {
      keyRef.current = optionsRef.current.runKey;
      saidRef.current = new Set();
      prevRef.current = null;
    }
    if (!definition || !live) return;
    const prev = prevRef.current;
    prevRef.current = live.nowMs;
    if (prev === null || live.nowMs <= prev) return;
    const due = calloutsDue(definition, live, prev, optionsRef.current).filter((c) => !saidRef.current.has(c.id));
    for (const c of due) saidRef.current.add(c.id);
    const toPlay = selectCallouts(freshCallouts(due, nowMs), settings);
    if (toPlay.length === 0) return;
    const playedAs = playCallouts(toPlay, settings, voices);
    setView({ last: toPlay[toPlay.length - 1] ?? null, playedAs });
  }, [definition, live, nowMs, settings, voices]);

  return { ...view, voiceAvailable: speechSupported() && voices.length > 0 };
}

/** Audio and (on iOS) speech start only after a gesture: unlock both on the first tap or key. */
function useAudioUnlock(): void {
  useEffect(() => {
    const unlock = () => {
      unlockAudio();
      if (speechSupported() && !window.speechSynthesis.speaking) window.speechSynthesis.resume();
      window.removeEventListener("pointerdown", unlock);
      window.removeEventListener("keydown", unlock);
    };
    window.addEventListener("pointerdown", unlock);
    window.addEventListener("keydown", unlock);
    return () => {
      window.removeEventListener("pointerdown", unlock);
      window.removeEventListener("keydown", unlock);
    };
  }, []);
}
