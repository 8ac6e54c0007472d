import type { EventBody } from "@/lib/events/schema";
import type { FlightInput, TimelineEvent } from "@/lib/tasks";

/** Flights of the given lengths (seconds), the first launched at `startMs`, each relaunch `gapMs` after the landing. */
export function backToBack(secs: readonly number[], gapMs = 1000, startMs = 0): FlightInput[] {
  let t = startMs;
  return secs.map((s) => {
    const f = { launchMs: t, landMs: t + Math.round(s * 1000) };
    t = f.landMs + gapMs;
    return f;
  });
}

/** Builds timeline events with valid, ordered UUID-shaped ids. */
export function eventLog() {
  let n = 0;
  const events: TimelineEvent[] = [];
  const add = (atMs: number, body: EventBody): string => {
    const id = `00000000-0000-7000-8000-${String(++n).padStart(12, "0")}`;
    events.push({ id, atMs, body });
    return id;
  };
  return {
    events,
    add,
    start: (atMs: number) => add(atMs, { kind: "window-start" }),
    launch: (atMs: number, lane = 0) => add(atMs, { kind: "launch", lane }),
    land: (atMs: number, lane = 0) => add(atMs, { kind: "landing", lane }),
    flight: (launchAtMs: number, landAtMs: number, lane = 0) => {
      add(launchAtMs, { kind: "launch", lane });
      add(landAtMs, { kind: "landing", lane });
    },
  };
}
