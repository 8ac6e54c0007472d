/** The parts of a SpeechSynthesisVoice the choice needs (so this stays testable without a browser). */
export type VoiceInfo = { voiceURI: string; name: string; lang: string; localService: boolean; default: boolean };

/**
 * The voices that speak with no network: only `localService` voices do (MDN,
 * SpeechSynthesisVoice.localService); remote voices fall silent at a field with no signal.
 */
export function localVoices<V extends VoiceInfo>(voices: readonly V[]): V[] {
  return voices.filter((v) => v.localService);
}

/**
 * The voice to speak with: the chosen local voice if it still exists, else the default
 * local voice, else a local voice in the page's language, else any local voice; null when
 * the device has no local voice (the caller then plays tones).
 */
export function pickVoice<V extends VoiceInfo>(voices: readonly V[], chosenURI: string | null, lang = "en"): V | null {
  const local = localVoices(voices);
  const base = lang.toLowerCase().split("-")[0] ?? "en";
  return (
    local.find((v) => chosenURI !== null && v.voiceURI === chosenURI) ??
    local.find((v) => v.default && v.lang.toLowerCase().startsWith(base)) ??
    local.find((v) => v.lang.toLowerCase().startsWith(base)) ??
    local[0] ??
    null
  );
}
