import type { EventBody, RunEvent, Stamp } from "@/lib/events/schema";

let n = 0;
/** A stored event as the device keeps it (UUID-shaped ids, increasing seq). */
export function stored(body: EventBody, stamp: Partial<Stamp> & { wallMs: number }, deviceId = "device-a"): RunEvent {
  n += 1;
  return {
    id: `00000000-0000-7000-8000-${String(n).padStart(12, "0")}`,
    runId: "00000000-0000-7000-8000-999999999999",
    deviceId,
    seq: n,
    // By default the steady clock runs with the wall clock (a device whose wall clock was not stepped).
    stamp: { monoMs: stamp.wallMs, pageId: "page-1", offset: null, ...stamp },
    body,
  };
}
