import { and, eq } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import type { TaskDefinition } from "@/lib/tasks/definition";
import type { Database } from "../index";
import { deriveAndStoreRuns } from "../queries/runs";
import { contestEntries, contestReflights, contestRounds, contests, fieldSessions, groupSlots, runLanes, runs, slotRecords, users } from "../schema";
import { DEMO_CONTEST_PHONE, insertDemoTaps, type DemoTap } from "./demo-phone-taps";

/**
 * Two records for one pilot in round 1 of the demo contest (invented): Oren Halloway's card was
 * entered twice by the officer with different times, and the first entry is kept beside the one
 * counting, waiting for the officer's decision on round 1's page. Does nothing when a record of his is kept already.
 */
export async function seedDemoRecords(db: Database, contestId: string): Promise<void> {
  const [slot] = await db.select({ id: groupSlots.id }).from(groupSlots)
    .innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId))
    .innerJoin(contestEntries, eq(contestEntries.id, groupSlots.entryId))
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.number, 1), eq(contestRounds.isFlyOff, false), eq(contestEntries.pilotName, "Oren Halloway")));
  if (!slot) return;
  const [kept] = await db.select({ id: slotRecords.id }).from(slotRecords).where(eq(slotRecords.slotId, slot.id)).limit(1);
  if (kept) return;
  const [officer] = await db.select({ id: users.id }).from(users).where(eq(users.email, "ines@example.com"));
  const at = new Date("2027-01-16T10:50:00Z");
  await db.insert(slotRecords).values({
    slotId: slot.id, paperFlights: [984, 2113], recordedBy: officer?.id ?? null, recordedAt: at, signedAt: at, signedFrom: "paper card", keptAt: new Date("2027-01-16T11:00:00Z"),
  });
}

/**
 * Two records for Bea Quillfeather's re-flight in round 2 of the demo contest (invented; after
 * ./demo-reflights.ts): Mara timed it on her phone (a run of round 2's task, signed on the phone) and the
 * phone's run synced before the officer entered the paper card, whose times differ. The card counts now;
 * the run is kept beside it, waiting for the officer's decision on round 2's page (both undecided on the
 * results). The run's result is derived from its events like any pushed run. Does nothing when the
 * grant has a kept record already, or has no timekeeper.
 */
export async function seedDemoReflightRecords(db: Database, contestId: string): Promise<void> {
  const [grant] = await db.select({ id: contestReflights.id, keeper: contestReflights.timekeeperUserId, task: contestRounds.task, clubId: contests.clubId, field: contests.fieldName })
    .from(contestReflights)
    .innerJoin(contestRounds, eq(contestRounds.id, contestReflights.roundId))
    .innerJoin(contests, eq(contests.id, contestRounds.contestId))
    .innerJoin(contestEntries, eq(contestEntries.id, contestReflights.entryId))
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.number, 2), eq(contestRounds.isFlyOff, false), eq(contestEntries.pilotName, "Bea Quillfeather")));
  if (!grant?.keeper) return;
  const [kept] = await db.select({ id: slotRecords.id }).from(slotRecords).where(eq(slotRecords.reflightId, grant.id)).limit(1);
  if (kept) return;
  const keeper = grant.keeper;
  const [keeperUser] = await db.select({ name: users.name }).from(users).where(eq(users.id, keeper));
  const task = grant.task as TaskDefinition;
  const start = Date.parse("2027-01-16T11:50:00Z");
  const runId = uuidv7({ msecs: start });
  // window start, then three flights of 141.3 s, 150.6 s and 168.4 s (the paper card says 141.2, 165.5, 173.0), then both sign
  const flights = [1413, 1506, 1684];
  const taps: DemoTap[] = [{ atMs: 0, body: { kind: "window-start" } }];
  let t = 5_000;
  for (const tenths of flights) {
    taps.push({ atMs: t, body: { kind: "launch", lane: 0 } }, { atMs: t + tenths * 100, body: { kind: "landing", lane: 0 } });
    t += tenths * 100 + 8_000;
  }
  taps.push({ atMs: t + 600_000, body: { kind: "signed", lane: 0 } });
  await db.transaction(async (tx) => {
    const sessionId = uuidv7({ msecs: start - 60_000 });
    await tx.insert(fieldSessions).values({ id: sessionId, ownerId: keeper, clubId: grant.clubId, fieldName: grant.field, startedAt: new Date(start - 60_000) });
    await tx.insert(runs).values({ id: runId, sessionId, createdBy: keeper, task, taskCode: task.letter ?? "custom", edition: task.edition, createdAt: new Date(start - 30_000) });
    await tx.insert(runLanes).values({ runId, lane: 0, pilotName: "Bea Quillfeather" });
    await insertDemoTaps(tx, { deviceId: DEMO_CONTEST_PHONE, keeperId: keeper, keeperName: keeperUser?.name ?? "Mara", runId, startMs: start, taps });
    await deriveAndStoreRuns(tx, [runId]);
    const signedAt = new Date(start + t + 600_000);
    await tx.insert(slotRecords).values({
      reflightId: grant.id, runId, lane: 0, recordedBy: keeper, recordedAt: new Date(start + t), signedAt,
      signedFrom: `on the phone: pilot Bea Quillfeather, timekeeper ${keeperUser?.name ?? "Mara"}`, keptAt: new Date("2027-01-16T12:05:00Z"),
    });
  });
}
