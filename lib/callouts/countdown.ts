import { VIBRATE, type Callout, type CalloutGroup, type CalloutTone } from "./types";

type Spec = { id: string; atMs: number; text: string; tone: CalloutTone; group: CalloutGroup; lane?: number | null };

/** Builds one callout with the vibration pattern of its tone. */
export function callout(spec: Spec): Callout {
  return { ...spec, lane: spec.lane ?? null, vibratePattern: VIBRATE[spec.tone] };
}

/**
 * "n", "n−1" … "1" at the whole seconds before `endAtMs` (ids `${prefix}:${k}`), the first
 * one optionally with its own text ("10 to target").
 */
export function countdown(prefix: string, endAtMs: number, seconds: readonly number[], group: CalloutGroup, options: { lane?: number | null; label?: (k: number) => string } = {}): Callout[] {
  return seconds.map((k) =>
    callout({ id: `${prefix}:${k}`, atMs: endAtMs - k * 1000, text: options.label?.(k) ?? String(k), tone: "tick", group, lane: options.lane ?? null }),
  );
}

/** 10, 9 … 1 */
export const LAST_TEN = [10, 9, 8, 7, 6, 5, 4, 3, 2, 1] as const;
/** 5 … 1 */
export const LAST_FIVE = [5, 4, 3, 2, 1] as const;

/** "1 minute", "7 minutes". */
export function minutesText(m: number): string {
  return m === 1 ? "1 minute" : `${m} minutes`;
}
