import { and, eq } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { expect } from "vitest";
import { contestEntries, contestRounds, events, groupSlots, runLanes, runs } from "@/db/schema";
import { officerDeviceId } from "@/lib/events/schema";
import { getCatalogueTask } from "@/lib/tasks";
import type { Cast } from "./authz-actors";
import { contestOfOwnersClub } from "./authz-contests";
import { db } from "./db";
import { insertSession } from "./records";

/**
 * A run the timekeeper `createdBy` timed for one pilot (task A, a guest lane named `pilotName`): a 120.0 s
 * flight and a 100-point penalty for launching outside the group's times (F3K.9.5), linked to the pilot's
 * slot in `roundId` (its paper card cleared). Straight into the database: these tests are about the officer's
 * set-aside, not sync. Returns the penalty event's id and the run's id.
 */
export async function insertPhonePenalty(createdBy: string, roundId: string, entryId: string, pilotName: string): Promise<{ eventId: string; runId: string }> {
  const sessionId = await insertSession(createdBy);
  const runId = uuidv7();
  const task = getCatalogueTask("A");
  await db.insert(runs).values({ id: runId, sessionId, createdBy, task, taskCode: "A", edition: String(task.edition), createdAt: new Date(1_767_000_060_000) });
  await db.insert(runLanes).values({ runId, lane: 0, pilotUserId: null, pilotName });
  const launchId = uuidv7();
  const eventId = uuidv7();
  const bodies = [
    { id: uuidv7(), body: { kind: "window-start" }, at: 0 },
    { id: launchId, body: { kind: "launch", lane: 0 }, at: 1000 },
    { id: uuidv7(), body: { kind: "landing", lane: 0 }, at: 121_000 },
    { id: eventId, body: { kind: "penalty", lane: 0, points: 100, reason: "Launched in the no-fly time", cause: "outside-time", launchId }, at: 200_000 },
  ];
  const deviceId = `records-${uuidv7()}`;
  await db.insert(events).values(bodies.map((b, i) => ({
    id: b.id, runId, deviceId, seq: i + 1, recordedBy: createdBy, kind: b.body.kind, body: b.body,
    wallMs: 1_767_000_100_000 + b.at, monoMs: 1000 + b.at, pageId: "records", correctedMs: 1_767_000_100_000 + b.at,
  })));
  await db.update(groupSlots).set({ runId, lane: 0, paperFlights: null }).where(and(eq(groupSlots.roundId, roundId), eq(groupSlots.entryId, entryId)));
  return { eventId, runId };
}

let penaltyEvent = "";

/** A drawn contest (contestOfOwnersClub) where the owner's phone gave Matrix Two a penalty in round 1. */
export async function phonePenaltyContestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const params = await contestOfOwnersClub(cast, true);
  const [round] = await db.select({ id: contestRounds.id }).from(contestRounds).where(eq(contestRounds.contestId, params.contestId!)).orderBy(contestRounds.number).limit(1);
  const [two] = await db.select({ id: contestEntries.id }).from(contestEntries).where(and(eq(contestEntries.contestId, params.contestId!), eq(contestEntries.pilotName, "Matrix Two")));
  penaltyEvent = (await insertPhonePenalty(cast.owner.id, round!.id, two!.id, "Matrix Two")).eventId;
  return { ...params, roundNumber: "1" };
}

/** The phone's penalty set aside, with why. */
export const setAsideBody = () => ({ eventId: penaltyEvent, reason: "Launched inside the window" });

/** After a 2xx: the run holds the officer's set-aside, recorded by the caller; taken out again for the next actor. */
export async function phonePenaltySetAside(ctx: { user: { id: string } }): Promise<void> {
  const rows = await db.select().from(events).where(eq(events.deviceId, officerDeviceId(penaltyEvent)));
  expect(rows).toHaveLength(1);
  expect(rows[0]).toMatchObject({ recordedBy: ctx.user.id, kind: "void", body: { kind: "void", targetId: penaltyEvent, setAside: { reason: "Launched inside the window" } } });
  await db.delete(events).where(eq(events.id, rows[0]!.id));
}
