import "server-only";
import { eq, sql } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { officerDeviceId, type EventBody } from "@/lib/events/schema";
import type { Database } from "../index";
import { events, users } from "../schema";
import { deriveAndStoreRuns } from "./runs";
import { holdDaysThenLockRuns } from "./club-day-locks";

/** What an officer's set-aside of a phone's penalty answered. */
export type SetAsideOutcome = { id: string; already: boolean } | "not_found" | "set_aside_already";

/**
 * An officer sets aside a penalty a timekeeper's phone gave (a `penalty` event on a run lane linked to
 * a slot or a re-flight grant of this round). The decision is an event in the run, written here as a
 * push would write one — its own device (`officer:<penalty id>`, seq 1: one set-aside per penalty, by the
 * (device, seq) key), the officer as `recordedBy`, the server's clock as its stamp (θ = 0), a UUIDv7 id,
 * the sync stamp of the insert — a `void` of the penalty with `setAside: { reason, by }` (by: the officer's name, for phones offline). The run is then
 * derived again from all its events (deriveAndStoreRuns: run_lanes.result_tenths and derived, a new
 * server_seq and xid on the run), so F3K.4.3's highest-of-the-attempt and F3K.4.1's zero are worked out
 * by runResult afresh and every phone pulls the event and the new results.
 *
 * Idempotent: a repeat by the same officer with the same reason (a double click, a retry) answers the
 * stored event (`already`), anything else once set aside is "set_aside_already" — the first decision
 * stands (reinstating is not offered). The run's open club days and then its row lock are taken before the check (the close's order), so two at once
 * take turns. "not_found": no such penalty event on a lane of this round.
 */
export async function setPhonePenaltyAside(db: Database, p: { roundId: string; eventId: string; userId: string; reason: string }): Promise<SetAsideOutcome> {
  return db.transaction(async (tx) => {
    const found = await tx.execute<{ run_id: string }>(sql`
      select ev.run_id from events ev
      where ev.id = ${p.eventId} and ev.kind = 'penalty'
        and (exists (select 1 from group_slots g where g.round_id = ${p.roundId} and g.run_id = ev.run_id and g.lane = (ev.body ->> 'lane')::int)
          or exists (select 1 from contest_reflights cr where cr.round_id = ${p.roundId} and cr.run_id = ev.run_id and cr.lane = (ev.body ->> 'lane')::int))`);
    const runId = found.rows[0]?.run_id;
    if (!runId) return "not_found";
    await holdDaysThenLockRuns(tx, [runId]);
    const deviceId = officerDeviceId(p.eventId);
    const prior = await tx.execute<{ id: string; recorded_by: string; reason: string | null }>(sql`
      select id, recorded_by, body -> 'setAside' ->> 'reason' as reason from events where device_id = ${deviceId} and seq = 1`);
    const before = prior.rows[0];
    if (before) return before.recorded_by === p.userId && before.reason === p.reason ? { id: before.id, already: true } : "set_aside_already";
    const now = Date.now();
    const id = uuidv7();
    const [officer] = await tx.select({ name: users.name }).from(users).where(eq(users.id, p.userId));
    const body: EventBody = { kind: "void", targetId: p.eventId, setAside: { reason: p.reason, by: officer?.name ?? undefined } };
    const inserted = await tx.insert(events).values({
      id, runId, deviceId, seq: 1, recordedBy: p.userId, kind: "void", body,
      wallMs: now, monoMs: 0, pageId: "officer", offsetThetaMs: 0, offsetDeltaMs: 0, offsetMeasuredAtMs: now, correctedMs: now, uncertaintyMs: 0,
    }).onConflictDoNothing().returning({ id: events.id });
    if (inserted.length === 0) return "set_aside_already"; // the key taken meanwhile (pushes cannot use the officer's device ids: lib/validations/sync-push.ts)
    await deriveAndStoreRuns(tx, [runId]);
    return { id, already: false };
  });
}
