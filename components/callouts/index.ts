/**
 * Callouts for the field screen: speech with local voices, synthesised tones, vibration,
 * and keeping the screen awake. Usage in the run screen:
 *
 *   const live = liveState(definition, events, nowMs, { laneCount });
 *   const callouts = useCallouts(definition, live, nowMs, { runKey: run.id, laneNames });
 *   const wake = useWakeLock(live.phase !== "ended");
 *   <WakeLockNote state={wake} />  <CalloutCaption callout={callouts.last} />
 */
export { useCallouts, type CalloutsView, type UseCalloutsOptions } from "./use-callouts";
export { useWakeLock, type WakeLockState } from "./use-wake-lock";
export { WakeLockNote } from "./wake-lock-note";
export { CalloutCaption } from "./callout-caption";
export { useCalloutSettings, loadCalloutSettings, saveCalloutSettings, CALLOUT_SETTINGS_KEY } from "./settings-store";
export { playCallouts, type PlayedAs } from "./player";
export { playTone, unlockAudio } from "./tones";
export { speak, speechSupported, useLocalVoices } from "./speech";
