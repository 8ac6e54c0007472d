/**
 * Field-timer callouts as pure data: what to say or beep, and when, from a task definition
 * and its live state. No browser APIs here (components/callouts plays them).
 */
export { allCallouts, calloutsDue, freshCallouts, type CalloutOptions } from "./schedule";
export { flightGoal, type FlightGoal } from "./targets";
export { planCallouts } from "./plan";
export { calloutSettingsSchema, DEFAULT_CALLOUT_SETTINGS, parseCalloutSettings, selectCallouts, type CalloutSettings } from "./settings";
export { localVoices, pickVoice, type VoiceInfo } from "./voices";
export { CALLOUT_GROUPS, VIBRATE, type Callout, type CalloutGroup, type CalloutTone, type StartPlan } from "./types";
