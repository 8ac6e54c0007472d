"use client";

import type { CalloutTone } from "@/lib/callouts";

/**
 * Synthesised tones (Web Audio OscillatorNode), one shape per kind so each is told apart
 * by ear: a short high blip for a count, two mid beeps for a minute, a rising pair at a
 * target, a long low tone at an end. Used when the user picks tones or no local voice exists.
 */
type Beep = { hz: number; startS: number; lengthS: number; toHz?: number };

const SHAPES: Record<CalloutTone, Beep[]> = {
  tick: [{ hz: 1320, startS: 0, lengthS: 0.08 }],
  minute: [
    { hz: 660, startS: 0, lengthS: 0.15 },
    { hz: 660, startS: 0.25, lengthS: 0.15 },
  ],
  target: [
    { hz: 784, startS: 0, lengthS: 0.12 },
    { hz: 1175, startS: 0.15, lengthS: 0.25 },
  ],
  end: [{ hz: 440, startS: 0, lengthS: 0.7, toHz: 330 }],
};

let context: AudioContext | null = null;

function audio(): AudioContext | null {
  if (typeof window === "undefined" || typeof window.AudioContext !== "function") return null;
  context ??= new window.AudioContext();
  return context;
}

/** Browsers start audio suspended until a user gesture: call this from a tap or key press. */
export function unlockAudio(): void {
  const ctx = audio();
  if (ctx && ctx.state === "suspended") void ctx.resume();
}

/** Plays the tone of a kind of callout now; returns false when Web Audio is unavailable. */
export function playTone(tone: CalloutTone): boolean {
  const ctx = audio();
  if (!ctx) return false;
  const t0 = ctx.currentTime;
  for (const beep of SHAPES[tone]) {
    const osc = ctx.createOscillator();
    const gain = ctx.createGain();
    osc.type = "square"; // carries outdoors better than a sine
    osc.frequency.setValueAtTime(beep.hz, t0 + beep.startS);
    if (beep.toHz) osc.frequency.linearRampToValueAtTime(beep.toHz, t0 + beep.startS + beep.lengthS);
    // A short fade in and out avoids clicks.
    gain.gain.setValueAtTime(0, t0 + beep.startS);
    gain.gain.linearRampToValueAtTime(0.25, t0 + beep.startS + 0.01);
    gain.gain.setValueAtTime(0.25, t0 + beep.startS + beep.lengthS - 0.02);
    gain.gain.linearRampToValueAtTime(0, t0 + beep.startS + beep.lengthS);
    osc.connect(gain).connect(ctx.destination);
    osc.start(t0 + beep.startS);
    osc.stop(t0 + beep.startS + beep.lengthS + 0.02);
  }
  return true;
}
