"use client";

import { pickVoice, type Callout, type CalloutSettings } from "@/lib/callouts";
import { speak } from "./speech";
import { playTone } from "./tones";

/** How a batch of callouts was played. */
export type PlayedAs = "voice" | "tones" | "none";

/**
 * Plays the callouts due in one frame as one utterance (or the most urgent tone), and
 * vibrates where the device can (navigator.vibrate: not in Safari or Firefox). Speech only
 * with a local voice; otherwise tones.
 */
export function playCallouts(callouts: readonly Callout[], settings: CalloutSettings, voices: readonly SpeechSynthesisVoice[]): PlayedAs {
  const first = mostUrgent(callouts);
  if (!first || settings.muted) return "none";
  if (settings.vibrate && typeof navigator !== "undefined" && typeof navigator.vibrate === "function") {
    navigator.vibrate(first.vibratePattern ?? [100]);
  }
  const voice = settings.output === "voice" ? pickVoice(voices, settings.voiceURI, document.documentElement.lang || "en") : null;
  if (voice) {
    speak(callouts.map((c) => c.text).join(". "), voice, first.tone !== "minute");
    return "voice";
  }
  return playTone(first.tone) ? "tones" : "none";
}

const RANK = { end: 0, target: 1, tick: 2, minute: 3 } as const;

/** The callout whose tone and vibration stand for the batch. */
function mostUrgent(callouts: readonly Callout[]): Callout | undefined {
  return [...callouts].sort((a, b) => RANK[a.tone] - RANK[b.tone])[0];
}
