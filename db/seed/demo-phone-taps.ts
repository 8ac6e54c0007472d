import { eq, sql } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import type { Database } from "../index";
import type { Tx } from "../queries/sync-db";
import { devices, events } from "../schema";

/** One tap of a demo phone: when (ms after the run's start), what, and the event's id when others name it. */
export type DemoTap = { atMs: number; body: Record<string, unknown>; id?: string };

/** The demo contest's timing phone (invented): Mara's, used by every contest run the seed times on a phone. */
export const DEMO_CONTEST_PHONE = "demo-phone-mara-contest";

/**
 * A demo phone's taps of one run, stored as its push would store them: the device registered to its
 * timekeeper, each event numbered after the device's last one (a phone's sequence runs across its runs,
 * `events_device_seq_uq`), stamped on a clock measured two minutes before the run started.
 */
export async function insertDemoTaps(db: Database | Tx, p: { deviceId: string; keeperId: string; keeperName: string; runId: string; startMs: number; taps: readonly DemoTap[] }): Promise<void> {
  await db.insert(devices).values({ id: p.deviceId, userId: p.keeperId, label: `${p.keeperName}'s contest timing phone` }).onConflictDoNothing();
  const [row] = await db.select({ last: sql<number>`coalesce(max(${events.seq}), 0)::int` }).from(events).where(eq(events.deviceId, p.deviceId));
  const last = row?.last ?? 0;
  await db.insert(events).values(p.taps.map((tap, i) => ({
    id: tap.id ?? uuidv7({ msecs: p.startMs + tap.atMs }), runId: p.runId, deviceId: p.deviceId, seq: last + i + 1, recordedBy: p.keeperId, kind: String(tap.body.kind), body: tap.body,
    wallMs: p.startMs + tap.atMs, monoMs: 5000 + tap.atMs, pageId: `demo-${p.runId}`,
    offsetThetaMs: 0, offsetDeltaMs: 24, offsetMeasuredAtMs: p.startMs - 120_000, correctedMs: p.startMs + tap.atMs, uncertaintyMs: 12,
  })));
}
