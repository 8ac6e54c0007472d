import { eq } from "drizzle-orm";
import { expect } from "vitest";
import { contestEntries, contestRounds, contests, groupSlots } from "@/db/schema";
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

let pair: [string, string] = ["", ""];

/** A drawn contest whose two entries fly in different groups of every round, for the draw's changes (swap, re-draw). */
export async function drawnContestOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const params = await contestOfOwnersClub(cast, true);
  const entries = await db.select({ id: contestEntries.id }).from(contestEntries).where(eq(contestEntries.contestId, params.contestId!));
  const rounds = await db.select({ id: contestRounds.id }).from(contestRounds).where(eq(contestRounds.contestId, params.contestId!));
  await db.insert(groupSlots).values(rounds.flatMap((r) => entries.map((e, i) => ({ roundId: r.id, entryId: e.id, groupNumber: i + 1 }))));
  pair = [entries[0]!.id, entries[1]!.id];
  return params;
}

/** The swap's body: round 1's two pilots trade groups (each actor allowed swaps them back). */
export const swapBody = () => ({ round: 1, a: pair[0], b: pair[1] });

/** After a 2xx withdrawal: the entry is marked withdrawn; un-withdraw it for the next actor. */
export async function entryReturns(): Promise<void> {
  const [row] = await db.select().from(contestEntries).where(eq(contestEntries.id, entryId));
  expect(row?.withdrawnAt).toBeInstanceOf(Date);
  await db.update(contestEntries).set({ withdrawnAt: null }).where(eq(contestEntries.id, entryId));
}
