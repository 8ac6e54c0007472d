"use client";

import { useState, useSyncExternalStore } from "react";
import { playCallouts, unlockAudio, useCalloutSettings, useLocalVoices } from "@/components/callouts";
import { Button } from "@/components/ui/button";
import { CALLOUT_GROUPS, VIBRATE, pickVoice, type Callout, type CalloutGroup, type CalloutSettings, type CalloutTone } from "@/lib/callouts";

const GROUP_LABELS: Record<CalloutGroup, string> = {
  minutes: "Every whole minute of working time left",
  lastSeconds: "The last 10 seconds and the end",
  targets: "Countdown to each target or maximum",
  landingWindow: "Landing window",
  preparation: "Preparation and no-fly period",
};

const SAMPLE: readonly [CalloutTone, string][] = [["minute", "7 minutes"], ["tick", "10 to target"], ["target", "target"], ["end", "End of working time"]];

const box = "flex min-h-touch items-center gap-3 rounded-xl border-2 border-line bg-raised px-4";

/** Callout choices for this device, with a test that plays them as the field screen will. */
export function CalloutSettingsForm() {
  const [settings, save] = useCalloutSettings();
  const voices = useLocalVoices();
  const [tested, setTested] = useState<string | null>(null);
  const set = (patch: Partial<CalloutSettings>) => save({ ...settings, ...patch });
  const setGroup = (g: CalloutGroup, on: boolean) => save({ ...settings, groups: { ...settings.groups, [g]: on } });
  // Known only in the browser; assumed possible while rendering on the server (no note flashes).
  const canVibrate = useSyncExternalStore(noSubscription, () => typeof navigator.vibrate === "function", () => true);

  function test() {
    unlockAudio();
    const sample: Callout[] = SAMPLE.map(([tone, text], i) => ({ id: `test:${i}`, atMs: i, text, tone, group: "minutes", lane: null, vibratePattern: VIBRATE[tone] }));
    const unmuted = { ...settings, muted: false };
    if (settings.output === "voice" && pickVoice(voices, settings.voiceURI)) {
      playCallouts(sample, unmuted, voices);
      setTested(`Said: “${sample.map((c) => c.text).join(". ")}”`);
      return;
    }
    // Tones one after another, so each kind is heard on its own.
    sample.forEach((c, i) => window.setTimeout(() => playCallouts([c], { ...unmuted, output: "tones" }, []), i * 900));
    setTested("Played the four tones: minute (two beeps), count (short blip), target (rising pair), end (long low tone).");
  }

  return (
    <div className="space-y-4">
      <label className={box}>
        <input type="checkbox" className="h-6 w-6" checked={settings.muted} onChange={(e) => set({ muted: e.target.checked })} />
        <span className="font-semibold">Mute all callouts</span>
      </label>
      {settings.muted ? <p className="text-sm text-muted">Muted: the field screen plays nothing. The choices below apply once you unmute.</p> : null}

      <fieldset className="space-y-2">
        <legend className="font-bold">Sound</legend>
        {(["voice", "tones"] as const).map((o) => (
          <label key={o} className={box}>
            <input type="radio" name="callout-output" className="h-6 w-6" checked={settings.output === o} onChange={() => set({ output: o })} />
            <span className="font-semibold">{o === "voice" ? "Spoken words" : "Tones only"}</span>
          </label>
        ))}
        {voices.length === 0 ? (
          <p className="text-sm text-muted">No voice on this phone works without signal, so tones are played instead.</p>
        ) : (
          <div className="space-y-1">
            <label htmlFor="callout-voice" className="block font-semibold">
              Voice (works offline)
            </label>
            <select
              id="callout-voice"
              className="block min-h-touch w-full rounded-lg border-2 border-line bg-raised px-3 text-lg text-ink"
              value={settings.voiceURI ?? ""}
              onChange={(e) => set({ voiceURI: e.target.value || null })}
            >
              <option value="">Phone’s default</option>
              {voices.map((v) => (
                <option key={v.voiceURI} value={v.voiceURI}>
                  {v.name} ({v.lang})
                </option>
              ))}
            </select>
          </div>
        )}
      </fieldset>

      <fieldset className="space-y-2">
        <legend className="font-bold">What to call out</legend>
        {CALLOUT_GROUPS.map((g) => (
          <label key={g} className={box}>
            <input type="checkbox" className="h-6 w-6" checked={settings.groups[g]} onChange={(e) => setGroup(g, e.target.checked)} />
            <span className="font-semibold">{GROUP_LABELS[g]}</span>
          </label>
        ))}
      </fieldset>

      <label className={box}>
        <input type="checkbox" className="h-6 w-6" checked={settings.vibrate} onChange={(e) => set({ vibrate: e.target.checked })} />
        <span className="font-semibold">Vibrate with each callout</span>
      </label>
      {canVibrate ? null : <p className="text-sm text-muted">This browser cannot vibrate (Safari and Firefox do not).</p>}

      <Button type="button" variant="secondary" onClick={test} className="w-full">
        Test
      </Button>
      <p role="status" className="text-sm">
        {tested}
      </p>
    </div>
  );
}

function noSubscription(): () => void {
  return () => {};
}
