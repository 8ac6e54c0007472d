import { eq } from "drizzle-orm";
import { expect } from "vitest";
import { contestEntries, contestRounds, contests } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import type { Actor, Cast } from "./authz-actors";
import { ownersClub } from "./authz-clubs";
import { db } from "./db";

/** Who may enter: the club's members, coaches and officers (and site admins); strangers 404. */
export const MEMBERS = (ok: number): Record<Actor, number> => ({
  signedOut: 401, owner: ok, otherPilot: ok, coachWithGrant: ok, coachWithoutGrant: 404, officerOtherClub: 404, admin: ok,
});

let entryId = "";

/** A contest of the owner's club (the owner is its officer) with 5 rounds and two paper entries; `drawn` gives it a seed. */
export async function contestOfOwnersClub(cast: Cast, drawn = false): Promise<Record<string, string>> {
  const club = await ownersClub(cast);
  const [c] = await db.insert(contests).values({ clubId: club.id, name: "Matrix Cup", startsOn: "2027-01-09", fieldName: "Matrix Meadow", drawSeed: drawn ? 1 : null }).returning();
  await db.insert(contestRounds).values(["A", "B", "D", "F", "G"].map((l, i) => ({ contestId: c!.id, number: i + 1, task: getCatalogueTask(l as "A") })));
  const rows = await db.insert(contestEntries).values([{ contestId: c!.id, pilotName: "Matrix One", paper: true }, { contestId: c!.id, pilotName: "Matrix Two", paper: true }]).returning();
  entryId = rows[0]!.id;
  return { contestId: c!.id, entryId };
}

/** After a 2xx withdrawal: the entry is marked withdrawn; un-withdraw it for the next actor. */
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
