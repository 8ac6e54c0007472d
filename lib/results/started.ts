import type { EventBody } from "@/lib/events/schema";
import { applyUndoAndCorrections } from "@/lib/tasks/timeline";

/**
 * Whether a window was ever flown: a working-time start or a launch that still counts (not
 * undone). A window set up but never started has no result (null, never 0.0) anywhere.
 * Reads bodies and ids only, so any list of a run's events will do (ours).
 */
export function wasStarted(events: readonly { id: string; body: EventBody }[]): boolean {
  const effective = applyUndoAndCorrections(events.map((e, i) => ({ id: e.id, atMs: i, body: e.body })));
  return effective.some((e) => e.body.kind === "window-start" || e.body.kind === "launch");
}
