/**
 * Callouts: what the field timer says (or beeps) and when. Pure data; the browser side
 * (speech, tones, vibration) lives in components/callouts.
 */

/** How a callout sounds when tones replace speech, and how strongly it vibrates. */
export type CalloutTone = "tick" | "minute" | "end" | "target";

/** The families a user can switch on and off in Settings. */
export type CalloutGroup = "minutes" | "lastSeconds" | "targets" | "landingWindow" | "preparation";

export const CALLOUT_GROUPS: readonly CalloutGroup[] = ["minutes", "lastSeconds", "targets", "landingWindow", "preparation"];

export type Callout = {
  /** Stable across frames and reloads: the same moment always has the same id, so it is said once. */
  id: string;
  /** When it is due, on the run's timeline (the clock of `liveState`). */
  atMs: number;
  text: string;
  tone: CalloutTone;
  group: CalloutGroup;
  /** The lane a target callout belongs to, else null. */
  lane: number | null;
  vibratePattern?: number[];
};

/**
 * A planned working-time start with its preparation and no-fly period (F3K.9), when the
 * run has one. The engine's events carry no plan; the field screen passes it if it keeps one.
 */
export type StartPlan = {
  /** Planned working-time start on the run's timeline. */
  startAtMs: number;
  /** Preparation time before the no-fly period (F3K.9: at least 5 min); 0 for none. */
  preparationSec: number;
  /** No-fly period just before the working time (F3K.9: 60 s); 0 for none. */
  noFlySec: number;
};

/** Vibration patterns (ms on, off, on…) by tone: short for ticks, long for ends. */
export const VIBRATE: Readonly<Record<CalloutTone, number[]>> = {
  tick: [60],
  minute: [200],
  target: [100, 80, 100],
  end: [400, 120, 400],
};
