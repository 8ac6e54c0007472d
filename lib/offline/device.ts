import { v7 as uuidv7 } from "uuid";
import type { ClockEstimate } from "@/lib/clock";
import type { Stamp } from "@/lib/events/schema";
import { getMeta, setMeta, type WindowcallDb } from "./db";

/**
 * The device's stable id, generated once and kept in `meta`. The read and the write
 * share one transaction, so two tabs starting together agree on one id.
 */
export async function getDeviceId(db: WindowcallDb): Promise<string> {
  return db.transaction("rw", db.meta, async () => {
    const existing = await getMeta(db, "deviceId");
    if (existing) return existing;
    const id = uuidv7();
    await setMeta(db, "deviceId", id);
    return id;
  });
}

let pageId: string | undefined;

/** Id of this page lifetime (module lifetime): a reload gets a new one, as the monotonic clock restarts. */
export function getPageId(): string {
  pageId ??= uuidv7();
  return pageId;
}

/** The clocks a stamp is taken from; `performance` and `Date.now` in a browser. */
export type StampClocks = { monoNow(): number; wallNow(): number };

const browserClocks: StampClocks = { monoNow: () => performance.now(), wallNow: () => Date.now() };

/**
 * Stamp for an input whose `event.timeStamp` is `inputMonoMs` (SYNC.md §2: the input's own
 * time, not the handler's). Wall time is "now" minus the lag since the input, not
 * timeOrigin + timeStamp, because the monotonic clock stops while the device sleeps.
 */
export function stampFromInput(
  inputMonoMs: number,
  offset: ClockEstimate | null,
  clocks: StampClocks = browserClocks,
  page: string = getPageId(),
): Stamp {
  const lag = Math.max(0, clocks.monoNow() - inputMonoMs);
  return { wallMs: clocks.wallNow() - lag, monoMs: inputMonoMs, pageId: page, offset };
}
