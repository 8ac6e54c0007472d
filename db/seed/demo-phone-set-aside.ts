import { and, eq } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { officerDeviceId } from "@/lib/events/schema";
import type { TaskDefinition } from "@/lib/tasks/definition";
import type { Database } from "../index";
import { deriveAndStoreRuns } from "../queries/runs";
import { contestEntries, contestRounds, events, fieldSessions, groupSlots, runLanes, runs, users } from "../schema";
import { DEMO_CONTEST_PHONE, insertDemoTaps, type DemoTap } from "./demo-phone-taps";

/**
 * A phone's penalty set aside by an officer in the demo contest (invented): Mara kept Hana Roskell's time in
 * round 3 (task D) on her phone — the same two flights as the card the officer had typed (284.8 s and 238.4 s),
 * so the demo's totals stay — and gave her 100 points for launching outside the group's times (F3K.9.5); Ines
 * set it aside on round 3's page: Hana launched on the signal. The run is linked to Hana's slot (its card
 * cleared, signed on the phone) and derived from its events, the officer's decision among them
 * (db/queries/contest-phone-set-aside.ts writes the same event). Does nothing when Hana's round 3 is a run already.
 */
export async function seedDemoPhoneSetAside(db: Database, contestId: string): Promise<void> {
  const [slot] = await db.select({ id: groupSlots.id, runId: groupSlots.runId, flights: groupSlots.paperFlights, task: contestRounds.task }).from(groupSlots)
    .innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId))
    .innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.number, 3), eq(contestRounds.isFlyOff, false), eq(contestEntries.pilotName, "Hana Roskell")));
  if (!slot || slot.runId !== null || !slot.flights) return;
  const people = await db.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.email, "mara@example.com"));
  const [officer] = await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.email, "ines@example.com"));
  const keeper = people[0];
  if (!keeper || !officer) return;
  const task = slot.task as TaskDefinition;
  const cardFlights = slot.flights;
  const start = Date.parse("2027-01-16T12:40:00Z");
  const sessionId = uuidv7({ msecs: start - 600_000 });
  const runId = uuidv7({ msecs: start - 60_000 });
  // one transaction: a failure leaves no half-made run behind (the next seed tries again from the slot)
  await db.transaction(async (tx) => {
    await tx.insert(fieldSessions).values({ id: sessionId, ownerId: keeper.id, fieldName: "Heronmoor Flats", startedAt: new Date(start - 600_000) });
    await tx.insert(runs).values({ id: runId, sessionId, createdBy: keeper.id, task, taskCode: task.letter ?? "custom", edition: String(task.edition), createdAt: new Date(start - 60_000) });
    await tx.insert(runLanes).values({ runId, lane: 0, pilotUserId: null, pilotName: "Hana Roskell" });
    // the card's flights, timed on the phone one after another from the working-time signal
    const taps: DemoTap[] = [{ atMs: 0, body: { kind: "window-start" } }];
    let t = 1000;
    let firstLaunch = "";
    for (const tenths of cardFlights) {
      const id = uuidv7({ msecs: start + t });
      if (!firstLaunch) firstLaunch = id;
      taps.push({ atMs: t, body: { kind: "launch", lane: 0 }, id });
      t += tenths * 100;
      taps.push({ atMs: t, body: { kind: "landing", lane: 0 } });
      t += 1000;
    }
    const penaltyId = uuidv7({ msecs: start + t });
    taps.push({ atMs: t, body: { kind: "penalty", lane: 0, points: 100, reason: "Launched before the signal", cause: "outside-time", launchId: firstLaunch }, id: penaltyId });
    taps.push({ atMs: t + 60_000, body: { kind: "signed", lane: 0 } });
    await insertDemoTaps(tx, { deviceId: DEMO_CONTEST_PHONE, keeperId: keeper.id, keeperName: keeper.name, runId, startMs: start, taps });
    // the officer's decision, as the round page writes it
    const decidedAt = Date.parse("2027-01-16T13:40:00Z");
    await tx.insert(events).values({
      id: uuidv7({ msecs: decidedAt }), runId, deviceId: officerDeviceId(penaltyId), seq: 1, recordedBy: officer.id, kind: "void",
      body: { kind: "void", targetId: penaltyId, setAside: { reason: "Hana launched on the signal: the timekeeper's watch ran early", by: officer.name } },
      wallMs: decidedAt, monoMs: 0, pageId: "officer", offsetThetaMs: 0, offsetDeltaMs: 0, offsetMeasuredAtMs: decidedAt, correctedMs: decidedAt, uncertaintyMs: 0,
    });
    const signedAt = new Date(start + t + 60_000);
    await tx.update(groupSlots).set({ runId, lane: 0, paperFlights: null, penaltyPoints: 0, signedAt, signedFrom: `on the phone: pilot Hana Roskell, timekeeper ${keeper.name}` })
      .where(eq(groupSlots.id, slot.id));
    await deriveAndStoreRuns(tx, [runId]);
  });
}
