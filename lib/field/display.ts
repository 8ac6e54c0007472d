import { formatTenths, type FlightStatus } from "@/lib/tasks";

/**
 * Working time left as m:ss, rounded UP to the whole second: the clock reads 0:00 only
 * when the time is over, as a countdown should (common practice for countdown clocks).
 */
export function formatCountdown(ms: number): string {
  const s = Math.max(0, Math.ceil(Math.round(ms) / 1000));
  return `${Math.floor(s / 60)}:${String(s % 60).padStart(2, "0")}`;
}

/** A running flight as m:ss.t, truncated to the tenth like the rules time it (F3K.7). */
export function formatRunning(ms: number): string {
  return formatTenths(Math.max(0, Math.floor(Math.floor(ms) / 100)));
}

export { secondsText } from "@/lib/tasks";

/** Whole seconds as m:ss, e.g. 120 → "2:00" (how a pilot says a target). */
export function clockText(sec: number): string {
  return `${Math.floor(sec / 60)}:${String(sec % 60).padStart(2, "0")}`;
}

/**
 * The target a flight is credited to, in the pilot's terms ("for the 3:00 target"), or null.
 * Ladders (H, K, M): the step the engine matched the flight to; task E: the target it attempted.
 */
export function creditedTargetText(f: { targetSec: number | null; status: string; creditedTenths: number }): string | null {
  if (f.targetSec === null) return null;
  const counts = f.status === "counted" || f.status === "capped";
  return counts ? `for the ${clockText(f.targetSec)} target` : `target ${clockText(f.targetSec)}`;
}

/** How a flight's status is drawn: a word and a shape, never colour alone. */
export const STATUS_MARK: Record<FlightStatus, { symbol: string; label: string }> = {
  counted: { symbol: "■", label: "counts" },
  capped: { symbol: "▲", label: "counts, capped" },
  "not-counted": { symbol: "□", label: "not counted" },
  invalid: { symbol: "✕", label: "scores zero" },
  open: { symbol: "↑", label: "in the air" },
};

const REASONS: Record<string, string> = {
  "launched-before-working-time": "launched before working time",
  "launched-after-working-time": "launched after working time",
  "landed-after-landing-window": "landed after the landing window",
  "never-landed": "never landed",
  "marked-invalid": "marked invalid",
  "beyond-launch-limit": "beyond the launch limit",
  superseded: "replaced by a later flight",
  "not-among-best": "not among the best",
  "beyond-ladder": "beyond the ladder",
  "no-target": "no target called",
  "target-missed": "target not reached",
  "after-final-target": "after the last target",
  "launched-before-signal": "launched before the signal",
  "launched-late": "launched late",
  "second-launch-in-attempt": "second launch in the attempt",
  "after-last-attempt": "after the last attempt",
};

/** A flight reason code in plain words. */
export function reasonText(reason: string | null): string | null {
  return reason === null ? null : (REASONS[reason] ?? reason.replaceAll("-", " "));
}
