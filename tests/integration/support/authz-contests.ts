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
