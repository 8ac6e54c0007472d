import { randomBytes } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { expect } from "vitest";
import { contestDisputes, contestEntries, contestPenalties, contestReflightRequests, contestReflights, contestRounds, contests, groupSlots, slotRecords } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import type { Actor, Cast } from "./authz-actors";
import { ownersClub } from "./authz-clubs";
import { db } from "./db";

/** Who may enter: the club's members, coaches and officers (and site admins); strangers 404. */
export const MEMBERS = (ok: number): Record<Actor, number> => ({
  signedOut: 401, owner: ok, otherPilot: ok, coachWithGrant: ok, coachWithoutGrant: 404, officerOtherClub: 404, admin: ok,
});

let entryId = "";

let contestId = "";

/**
 * A contest of the owner's club (the owner is its officer) with 5 rounds and two paper entries; `drawn` gives it
 * a seed and puts both entries in group 1 of round 1, Matrix One with a signed paper card of 150.0 s (task A);
 * `published` gives it a public results link.
 */
export async function contestOfOwnersClub(cast: Cast, drawn = false, published = false): Promise<Record<string, string>> {
  const club = await ownersClub(cast);
  const [c] = await db.insert(contests).values({
    clubId: club.id, name: "Matrix Cup", startsOn: "2027-01-09", fieldName: "Matrix Meadow", drawSeed: drawn ? 1 : null,
    publicToken: published ? randomBytes(32).toString("base64url") : null,
  }).returning();
  const rounds = await db.insert(contestRounds).values(["A", "B", "D", "F", "G"].map((l, i) => ({ contestId: c!.id, number: i + 1, task: getCatalogueTask(l as "A") }))).returning();
  const rows = await db.insert(contestEntries).values([{ contestId: c!.id, pilotName: "Matrix One", paper: true }, { contestId: c!.id, pilotName: "Matrix Two", paper: true }]).returning();
  if (drawn) {
    await db.insert(groupSlots).values([
      { roundId: rounds[0]!.id, groupNumber: 1, entryId: rows[0]!.id, paperFlights: [1500], signedAt: new Date(), signedFrom: "paper card" },
      { roundId: rounds[0]!.id, groupNumber: 1, entryId: rows[1]!.id },
    ]);
  }
  entryId = rows[0]!.id;
  contestId = c!.id;
  return { contestId: c!.id, entryId };
}

let pair: [string, string] = ["", ""];

/** A drawn contest whose two entries fly in different groups of every round, for the draw's changes (swap, re-draw). */
export async function drawnContestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const params = await contestOfOwnersClub(cast);
  await db.update(contests).set({ drawSeed: 1 }).where(eq(contests.id, params.contestId!));
  const entries = await db.select({ id: contestEntries.id }).from(contestEntries).where(eq(contestEntries.contestId, params.contestId!));
  const rounds = await db.select({ id: contestRounds.id }).from(contestRounds).where(eq(contestRounds.contestId, params.contestId!));
  await db.insert(groupSlots).values(rounds.flatMap((r) => entries.map((e, i) => ({ roundId: r.id, entryId: e.id, groupNumber: i + 1 }))));
  pair = [entries[0]!.id, entries[1]!.id];
  return params;
}

/** The swap's body: round 1's two pilots trade groups (each actor allowed swaps them back). */
export const swapBody = () => ({ round: 1, a: pair[0], b: pair[1] });

/** A member reads the standings: Matrix One's 150.0 s card is the group's best (1000 points). */
export async function showsStandings(_ctx: unknown, res: Response): Promise<void> {
  const body = (await res.json()) as { standings: { pilots: { name: string; totalTenths: number }[] } };
  expect(body.standings.pilots.map((p) => [p.name, p.totalTenths])).toEqual([["Matrix One", 10000], ["Matrix Two", 0]]);
}

/** The officer's paper card for Matrix One in group 1 of round 1: 180.0 s, signed. */
export const cardsBody = () => ({ groupNumber: 1, cards: [{ entryId, flights: [1800], penaltyPoints: 0, signed: true }] });

/** After a 2xx: the card is stored with who entered it, then cleared for the next actor. */
export async function cardsSaved(ctx: { user: { id: string } }): Promise<void> {
  const rows = await db.select().from(groupSlots).where(eq(groupSlots.entryId, entryId));
  expect(rows[0]).toMatchObject({ paperFlights: [1800], recordedBy: ctx.user.id, signedFrom: "paper card" });
  await db.update(groupSlots).set({ paperFlights: null, recordedBy: null, signedAt: null, signedFrom: null }).where(eq(groupSlots.entryId, entryId));
}

/** The officer unlinks Matrix One's (absent) timed run in round 1: allowed for officers, changes no result. */
export const unlinkBody = () => ({ entryId, runId: null, lane: null });

/** The officer makes the club's owner (a member, not flying in the group: both entries are paper ones) Matrix One's timekeeper in round 1. */
export const timekeepersBody = (ctx: { cast: Cast } | null) => ({ groupNumber: 1, timekeepers: [{ entryId, timekeeperUserId: ctx?.cast.owner.id ?? null }] });

/** After a 2xx: the owner is Matrix One's timekeeper, assigned by the caller; cleared for the next actor. */
export async function timekeeperSaved(ctx: { user: { id: string }; cast: Cast }): Promise<void> {
  const rows = await db.select().from(groupSlots).where(eq(groupSlots.entryId, entryId));
  expect(rows[0]).toMatchObject({ timekeeperUserId: ctx.cast.owner.id, timekeeperAssignedBy: ctx.user.id });
  expect(rows[0]?.timekeeperAssignedAt).toBeInstanceOf(Date);
  await db.update(groupSlots).set({ timekeeperUserId: null, timekeeperAssignedBy: null, timekeeperAssignedAt: null }).where(eq(groupSlots.entryId, entryId));
}

/** After a 2xx: the link returned is the one stored. */
export async function linkMade(_ctx: unknown, res: Response): Promise<void> {
  const body = (await res.json()) as { token: string };
  const [row] = await db.select({ token: contests.publicToken }).from(contests).where(eq(contests.id, contestId));
  expect(row?.token).toBe(body.token);
}

/** After a 2xx revocation: no link; a link again for the next actor. */
export async function linkRevoked(): Promise<void> {
  const [row] = await db.select({ token: contests.publicToken }).from(contests).where(eq(contests.id, contestId));
  expect(row?.token).toBeNull();
  await db.update(contests).set({ publicToken: randomBytes(32).toString("base64url") }).where(eq(contests.id, contestId));
}

/** After a 2xx withdrawal: the entry is marked withdrawn; un-withdraw it for the next actor. */
/** The officer's PATCH set the entry's team and class; both go back for the next caller. */
export async function entryChanged(): Promise<void> {
  const [row] = await db.select().from(contestEntries).where(eq(contestEntries.id, entryId));
  expect([row?.team, row?.pilotClass]).toEqual(["Updraft", "junior"]);
  await db.update(contestEntries).set({ team: null, pilotClass: "senior" }).where(eq(contestEntries.id, entryId));
}

export async function entryReturns(): Promise<void> {
  const [row] = await db.select().from(contestEntries).where(eq(contestEntries.id, entryId));
  expect(row?.withdrawnAt).toBeInstanceOf(Date);
  await db.update(contestEntries).set({ withdrawnAt: null }).where(eq(contestEntries.id, entryId));
}

/** The same contest with an entry fee (entries close in a week) and an unpaid entry of the owner's own, for the payment rows. */
export async function feeContestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const { contestId } = await contestOfOwnersClub(cast);
  await db.update(contests).set({ entryFeeCents: 1500, currency: "eur", entriesCloseAt: new Date(Date.now() + 7 * 86_400_000) }).where(eq(contests.id, contestId!));
  const [own] = await db.insert(contestEntries).values({ contestId: contestId!, pilotUserId: cast.owner.id, pilotName: cast.owner.name }).returning();
  entryId = own!.id;
  return { contestId: contestId!, entryId };
}

/** Only the entry's own pilot starts paying it: the owner; every other actor finds no such entry. */
export const OWN_ENTRY = (ok: number): Record<Actor, number> => ({
  signedOut: 401, owner: ok, otherPilot: 404, coachWithGrant: 404, coachWithoutGrant: 404, officerOtherClub: 404, admin: 404,
});

/** After a 2xx cash marking: the entry is paid in cash; unpaid again for the next actor. */
export async function cashReturns(): Promise<void> {
  const [row] = await db.select().from(contestEntries).where(eq(contestEntries.id, entryId));
  expect([row?.paymentStatus, row?.paymentRef]).toEqual(["paid", "cash"]);
  await db.update(contestEntries).set({ paymentStatus: "pending", paymentRef: null, paidAt: null, paymentMarkedBy: null }).where(eq(contestEntries.id, entryId));
}

/** The officer grants Matrix One a re-flight of round 1 with the original group (F3K.9.6). */
export const grantReflightBody = () => ({ entryId, cause: "organiser", placement: "original-group", groupNumber: 1, reason: "Timer failed" });

/** After a 2xx: the re-flight is stored with who granted it; removed for the next actor. */
export async function reflightGranted(ctx: { user: { id: string } }): Promise<void> {
  const rows = await db.select().from(contestReflights).where(eq(contestReflights.entryId, entryId));
  expect(rows).toHaveLength(1);
  expect(rows[0]).toMatchObject({ placement: "original-group", groupNumber: 1, grantedBy: ctx.user.id, reason: "Timer failed" });
  await db.delete(contestReflights).where(eq(contestReflights.entryId, entryId));
}

/** A drawn contest (as contestOfOwnersClub) where Matrix One was granted a re-flight of round 1 with the original group. */
export async function reflightContestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const params = await contestOfOwnersClub(cast, true);
  const [round] = await db.select({ id: contestRounds.id }).from(contestRounds).where(eq(contestRounds.contestId, params.contestId!)).orderBy(contestRounds.number).limit(1);
  await db.insert(contestReflights).values({ roundId: round!.id, entryId, cause: "organiser", placement: "original-group", groupNumber: 1 });
  return { ...params, roundNumber: "1" };
}

/** The re-flight's paper card: 120.0 s, signed. */
export const recordReflightBody = () => ({ entryId, flights: [1200], runId: null, lane: null, signed: true });

/** After a 2xx: the re-flight's card is stored with who recorded it; cleared for the next actor. */
export async function reflightRecorded(ctx: { user: { id: string } }): Promise<void> {
  const [row] = await db.select().from(contestReflights).where(eq(contestReflights.entryId, entryId));
  expect(row).toMatchObject({ paperFlights: [1200], recordedBy: ctx.user.id, signedFrom: "marked by an officer" });
  await db.update(contestReflights).set({ paperFlights: null, recordedBy: null, recordedAt: null, signedAt: null, signedFrom: null }).where(eq(contestReflights.entryId, entryId));
}

/** The owner times Matrix One's re-flight (reflightContestOfOwnersClub grants it). */
export const reflightTimekeeperBody = (ctx: { cast: Cast } | null) => ({ entryId, timekeeperUserId: ctx?.cast.owner.id ?? null });

/** After a 2xx: the owner is the re-flight's timekeeper, named by the caller; cleared for the next actor. */
export async function reflightTimekeeperSaved(ctx: { user: { id: string }; cast: Cast }): Promise<void> {
  const [row] = await db.select().from(contestReflights).where(eq(contestReflights.entryId, entryId));
  expect(row).toMatchObject({ timekeeperUserId: ctx.cast.owner.id, timekeeperAssignedBy: ctx.user.id });
  expect(row?.timekeeperAssignedAt).toBeInstanceOf(Date);
  await db.update(contestReflights).set({ timekeeperUserId: null, timekeeperAssignedBy: null, timekeeperAssignedAt: null }).where(eq(contestReflights.entryId, entryId));
}

let requestId = "";

/** A drawn contest with a re-flight request for Matrix One's round 1, as a timekeeper's phone asked it (rain, original group). */
export async function reflightRequestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const params = await contestOfOwnersClub(cast, true);
  const [round] = await db.select({ id: contestRounds.id }).from(contestRounds).where(eq(contestRounds.contestId, params.contestId!)).orderBy(contestRounds.number).limit(1);
  const [r] = await db.insert(contestReflightRequests).values({
    roundId: round!.id, entryId, eventId: crypto.randomUUID(), runId: crypto.randomUUID(), lane: 0, cause: "rain", placement: "original-group", askedAt: new Date(),
  }).returning();
  requestId = r!.id;
  return { ...params, roundNumber: "1" };
}

/** The officer dismisses the request. */
export const dismissRequestBody = () => ({ requestId, decision: "dismiss" });

/** After a 2xx: the request is dismissed by the caller; opened again for the next actor. */
export async function requestDismissed(ctx: { user: { id: string } }): Promise<void> {
  const [row] = await db.select().from(contestReflightRequests).where(eq(contestReflightRequests.id, requestId));
  expect(row).toMatchObject({ status: "dismissed", decidedBy: ctx.user.id });
  await db.update(contestReflightRequests).set({ status: "open", decidedBy: null, decidedAt: null }).where(eq(contestReflightRequests.id, requestId));
}

/** A dispute about Matrix One's round 1, lodged by the pilot. */
export const lodgeDisputeBody = () => ({ entryId, subject: "The third flight was not counted", lodgedBy: "Matrix One (pilot)" });

/** After a 2xx: the dispute is stored open with the officer who recorded it; removed for the next actor. */
export async function disputeLodged(ctx: { user: { id: string } }): Promise<void> {
  const rows = await db.select().from(contestDisputes).where(eq(contestDisputes.entryId, entryId));
  expect(rows).toHaveLength(1);
  expect(rows[0]).toMatchObject({ status: "open", recordedBy: ctx.user.id, lodgedBy: "Matrix One (pilot)" });
  await db.delete(contestDisputes).where(eq(contestDisputes.entryId, entryId));
}

let disputeId = "";

/** A drawn contest (as contestOfOwnersClub) with an open dispute about Matrix One's round 1. */
export async function disputeContestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const params = await contestOfOwnersClub(cast, true);
  const [round] = await db.select({ id: contestRounds.id }).from(contestRounds).where(eq(contestRounds.contestId, params.contestId!)).orderBy(contestRounds.number).limit(1);
  const [d] = await db.insert(contestDisputes).values({ roundId: round!.id, entryId, subject: "Landing not counted", lodgedBy: "Matrix One (pilot)" }).returning();
  disputeId = d!.id;
  return { ...params, roundNumber: "1" };
}

/** The dispute rejected with an outcome (no action). */
export const resolveDisputeBody = () => ({ disputeId, status: "rejected", outcome: "The timekeeper's card shows the landing after the end of working time" });

/** After a 2xx: the dispute is rejected by the caller with when; open again for the next actor. */
export async function disputeResolved(ctx: { user: { id: string } }): Promise<void> {
  const [row] = await db.select().from(contestDisputes).where(eq(contestDisputes.id, disputeId));
  expect(row).toMatchObject({ status: "rejected", resolvedBy: ctx.user.id, action: null });
  expect(row!.resolvedAt).toBeInstanceOf(Date);
  await db.update(contestDisputes).set({ status: "open", outcome: null, resolvedBy: null, resolvedAt: null }).where(eq(contestDisputes.id, disputeId));
}

/** An officer's penalty for Matrix One in round 1: 300 points, a person touched in a safety area (F3K.4.3). */
export const givePenaltyBody = () => ({ entryId, cause: "person-in-safety-area", points: 300, note: "Touched a helper" });

/** After a 2xx: the penalty is stored with who gave it; removed for the next actor. */
export async function penaltyGiven(ctx: { user: { id: string } }): Promise<void> {
  const rows = await db.select().from(contestPenalties).where(eq(contestPenalties.entryId, entryId));
  expect(rows).toHaveLength(1);
  expect(rows[0]).toMatchObject({ cause: "person-in-safety-area", points: 300, givenBy: ctx.user.id, removedAt: null });
  await db.delete(contestPenalties).where(eq(contestPenalties.entryId, entryId));
}

let penaltyId = "";

/** A drawn contest (as contestOfOwnersClub) with an officer's penalty for Matrix One in round 1. */
export async function penaltyContestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const params = await contestOfOwnersClub(cast, true);
  const [round] = await db.select({ id: contestRounds.id }).from(contestRounds).where(eq(contestRounds.contestId, params.contestId!)).orderBy(contestRounds.number).limit(1);
  const [p] = await db.insert(contestPenalties).values({ roundId: round!.id, entryId, cause: "outside-time", points: 100 }).returning();
  penaltyId = p!.id;
  return { ...params, roundNumber: "1" };
}

/** The penalty removed, with why. */
export const removePenaltyBody = () => ({ penaltyId, reason: "Given to the wrong pilot" });

/** After a 2xx: the penalty is kept, marked removed by the caller with when and why; counting again for the next actor. */
export async function penaltyRemoved(ctx: { user: { id: string } }): Promise<void> {
  const [row] = await db.select().from(contestPenalties).where(eq(contestPenalties.id, penaltyId));
  expect(row).toMatchObject({ removedBy: ctx.user.id, removedReason: "Given to the wrong pilot", points: 100 });
  expect(row!.removedAt).toBeInstanceOf(Date);
  await db.update(contestPenalties).set({ removedBy: null, removedAt: null, removedReason: null }).where(eq(contestPenalties.id, penaltyId));
}

/** A drawn contest (as contestOfOwnersClub) where Matrix One's round 1 has a second record waiting: an earlier paper card of 90.0 s. */
export async function recordsContestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const params = await contestOfOwnersClub(cast, true);
  const [slot] = await db.select({ id: groupSlots.id }).from(groupSlots).where(eq(groupSlots.entryId, entryId));
  await db.insert(slotRecords).values({ slotId: slot!.id, paperFlights: [900] });
  return { ...params, roundNumber: "1" };
}

/** The officer keeps Matrix One's counting record (the waiting one is set aside). */
export const keepRecordBody = () => ({ entryId, recordId: null });

/** After a 2xx: the waiting record is set aside by the caller; waiting again for the next actor. */
export async function recordDecided(ctx: { user: { id: string } }): Promise<void> {
  const [slot] = await db.select({ id: groupSlots.id }).from(groupSlots).where(eq(groupSlots.entryId, entryId));
  const rows = await db.select().from(slotRecords).where(eq(slotRecords.slotId, slot!.id));
  expect(rows).toHaveLength(1);
  expect(rows[0]).toMatchObject({ outcome: "set-aside", decidedBy: ctx.user.id });
  await db.update(slotRecords).set({ outcome: null, decidedBy: null, decidedAt: null }).where(eq(slotRecords.slotId, slot!.id));
}

/** A re-flight contest (reflightContestOfOwnersClub) where Matrix One's re-flight has a second record waiting: an earlier paper card of 90.0 s. */
export async function reflightRecordsContestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const params = await reflightContestOfOwnersClub(cast);
  const [grant] = await db.select({ id: contestReflights.id }).from(contestReflights).where(eq(contestReflights.entryId, entryId));
  await db.insert(slotRecords).values({ reflightId: grant!.id, paperFlights: [900] });
  return params;
}

/** After a 2xx: the re-flight's waiting record is set aside by the caller; waiting again for the next actor. */
export async function reflightRecordDecided(ctx: { user: { id: string } }): Promise<void> {
  const [grant] = await db.select({ id: contestReflights.id }).from(contestReflights).where(eq(contestReflights.entryId, entryId));
  const rows = await db.select().from(slotRecords).where(eq(slotRecords.reflightId, grant!.id));
  expect(rows).toHaveLength(1);
  expect(rows[0]).toMatchObject({ outcome: "set-aside", decidedBy: ctx.user.id });
  await db.update(slotRecords).set({ outcome: null, decidedBy: null, decidedAt: null }).where(eq(slotRecords.reflightId, grant!.id));
}

/**
 * A contest ready for its fly-off: the 5 preliminary rounds all scored (Matrix One 150.0 s, Matrix Two
 * 120.0 s on signed paper cards), a fly-off of 3 rounds planned for the best 2, not drawn yet.
 */
export async function flyOffContestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const params = await contestOfOwnersClub(cast);
  await db.update(contests).set({ drawSeed: 1, flyOffPilots: 2 }).where(eq(contests.id, params.contestId!));
  const entries = await db.select({ id: contestEntries.id, name: contestEntries.pilotName }).from(contestEntries).where(eq(contestEntries.contestId, params.contestId!));
  const rounds = await db.select({ id: contestRounds.id }).from(contestRounds).where(eq(contestRounds.contestId, params.contestId!));
  await db.insert(groupSlots).values(rounds.flatMap((r) => entries.map((e) => ({
    roundId: r.id, entryId: e.id, groupNumber: 1, paperFlights: [e.name === "Matrix One" ? 1500 : 1200], signedAt: new Date(), signedFrom: "paper card",
  }))));
  await db.insert(contestRounds).values((["M", "A", "B"] as const).map((l, i) => ({ contestId: params.contestId!, number: i + 1, isFlyOff: true, task: getCatalogueTask(l) })));
  return params;
}

/** After a 2xx: both pilots fly each of the 3 fly-off rounds in group 1 (a draw again by the next caller replaces it). */
export async function flyOffDrawn(_ctx: unknown, res: Response): Promise<void> {
  expect(await res.json()).toEqual({ pilots: ["Matrix One", "Matrix Two"], tiedAtCutOff: [] });
  const rows = await db.select({ roundId: groupSlots.roundId, groupNumber: groupSlots.groupNumber }).from(groupSlots)
    .innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId))
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, true)));
  expect(rows).toHaveLength(6);
  expect(new Set(rows.map((r) => r.groupNumber))).toEqual(new Set([1]));
}
