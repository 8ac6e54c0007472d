"use client";

import { useEffect, useState } from "react";
import { localVoices } from "@/lib/callouts";

/** True when the browser has speech synthesis at all. */
export function speechSupported(): boolean {
  return typeof window !== "undefined" && "speechSynthesis" in window && typeof SpeechSynthesisUtterance === "function";
}

/**
 * The device's local voices (MDN: only `localService` voices speak offline). The list
 * arrives asynchronously in Chromium, hence the `voiceschanged` listener.
 */
export function useLocalVoices(): SpeechSynthesisVoice[] {
  const [voices, setVoices] = useState<SpeechSynthesisVoice[]>([]);
  useEffect(() => {
    if (!speechSupported()) return;
    const synth = window.speechSynthesis;
    const read = () => setVoices(localVoices(synth.getVoices()));
    read();
    synth.addEventListener("voiceschanged", read);
    return () => synth.removeEventListener("voiceschanged", read);
  }, []);
  return voices;
}

/**
 * Says `text` with `voice`. An urgent callout (a count, a target, an end) cuts off what is
 * still being said, so numbers are never heard late.
 */
export function speak(text: string, voice: SpeechSynthesisVoice, urgent: boolean): void {
  if (!speechSupported()) return;
  const synth = window.speechSynthesis;
  if (urgent && (synth.speaking || synth.pending)) synth.cancel();
  const utterance = new SpeechSynthesisUtterance(text);
  utterance.voice = voice;
  utterance.lang = voice.lang;
  utterance.rate = 1.15;
  synth.speak(utterance);
}
