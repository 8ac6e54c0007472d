import { callout, countdown, LAST_FIVE, minutesText } from "./countdown";
import type { Callout, StartPlan } from "./types";

/**
 * Preparation and no-fly callouts before a planned working-time start (F3K.9: preparation,
 * then a 60 s no-fly period; the last 5 s before test time ends and before working time
 * starts are announced). Reading: test flying ends where the no-fly period begins.
 * Whole minutes to the start are called during the preparation; the start itself is
 * announced by the working-time callouts ("10 minutes") once it is recorded.
 */
export function planCallouts(plan: StartPlan): Callout[] {
  const start = plan.startAtMs;
  const noFlyAt = start - plan.noFlySec * 1000;
  const firstAt = noFlyAt - plan.preparationSec * 1000;
  const key = `plan:${Math.round(start)}`;
  const out: Callout[] = [];
  for (let m = Math.floor((plan.preparationSec + plan.noFlySec) / 60); m >= 1; m--) {
    const atMs = start - m * 60_000;
    if (plan.noFlySec > 0 && atMs === noFlyAt) continue; // said as the no-fly call instead
    out.push(callout({ id: `${key}:min:${m}`, atMs, text: `${minutesText(m)} to working time`, tone: "minute", group: "preparation" }));
  }
  if (plan.noFlySec > 0) {
    out.push(...countdown(`${key}:test`, noFlyAt, LAST_FIVE, "preparation"));
    const text = plan.noFlySec % 60 === 0 ? `No flying. ${minutesText(plan.noFlySec / 60)} to working time` : "No flying";
    out.push(callout({ id: `${key}:nofly`, atMs: noFlyAt, text, tone: "end", group: "preparation" }));
  }
  out.push(...countdown(`${key}:start`, start, LAST_FIVE, "preparation"));
  return out.filter((c) => c.atMs >= firstAt && c.atMs < start);
}
