import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { expect } from "vitest";
import { clubDays, clubFields, clubs, invitations, memberships } from "@/db/schema";
import { hashEmailToken, newEmailToken } from "@/lib/auth/email-tokens";
import type { Actor, Cast } from "./authz-actors";
import { db, freshUser } from "./db";
import { addPhone, dayRun } from "./day-records";

/**
 * Records for the club rows of the authorisation matrix: a club of the cast's own, where the owner
 * is the officer, the other pilot a member and the granted coach its coach; the coach without a
 * grant, the officer of another club and the admin are not in it (the admin passes as site admin).
 */
export async function ownersClub(cast: Cast): Promise<{ id: string; slug: string }> {
  const slug = `matrix-club-${randomUUID().slice(0, 8)}`;
  const [club] = await db.insert(clubs).values({ name: "Matrix Owner's Club", slug }).returning();
  await db.insert(memberships).values([
    { clubId: club!.id, userId: cast.owner.id, role: "officer" },
    { clubId: club!.id, userId: cast.otherPilot.id, role: "member" },
    { clubId: club!.id, userId: cast.coachWithGrant.id, role: "coach" },
  ]);
  return { id: club!.id, slug };
}

/** Who may act for the club: its officer and site admins; members below the role get 403, strangers 404. */
export const OFFICERS_ONLY = (ok: number): Record<Actor, number> => ({
  signedOut: 401, owner: ok, otherPilot: 403, coachWithGrant: 403, coachWithoutGrant: 404, officerOtherClub: 404, admin: ok,
});

/** A member of the owner's club whom the officer may remove or move; each removal is checked and undone by `rejoins`. */
let target: { clubId: string; userId: string; fieldId?: string } | null = null;

export async function memberOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const club = await ownersClub(cast);
  const member = await freshUser("matrix-club-member");
  await db.insert(memberships).values({ clubId: club.id, userId: member.id, role: "member" });
  target = { clubId: club.id, userId: member.id };
  return { slug: club.slug, userId: member.id };
}

/** After a 2xx removal: the member is gone; put them back for the next actor. */
export async function rejoins(): Promise<void> {
  const mine = and(eq(memberships.clubId, target!.clubId), eq(memberships.userId, target!.userId));
  expect(await db.select().from(memberships).where(mine)).toEqual([]);
  await db.insert(memberships).values({ clubId: target!.clubId, userId: target!.userId, role: "member" });
}

export async function fieldOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const club = await ownersClub(cast);
  const [field] = await db.insert(clubFields).values({ clubId: club.id, name: "Matrix Meadow", localRules: "Matrix rule" }).returning();
  target = { clubId: club.id, userId: "", fieldId: field!.id };
  return { slug: club.slug, fieldId: field!.id };
}

/** After a 2xx field removal: the field is gone; put it back (same id) for the next actor. */
export async function fieldReturns(): Promise<void> {
  expect(await db.select().from(clubFields).where(eq(clubFields.id, target!.fieldId!))).toEqual([]);
  await db.insert(clubFields).values({ id: target!.fieldId!, clubId: target!.clubId, name: "Matrix Meadow" });
}

/** One unused invitation per actor to a club none of them is in (the link is the credential: any signed-in account joins). */
const tokens = new Map<string, string>();
export async function invitationsForEveryone(cast: Cast): Promise<Record<string, string>> {
  const inviter = (await freshUser("matrix-inviter")).id;
  const [club] = await db.insert(clubs).values({ name: "Matrix Inviting Club", slug: `matrix-inviting-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values({ clubId: club!.id, userId: inviter, role: "officer" });
  for (const actor of Object.keys(cast)) {
    const { token, tokenHash } = newEmailToken();
    tokens.set(actor, token);
    await db.insert(invitations).values({ clubId: club!.id, email: `matrix-${actor}@example.com`, role: "member", tokenHash, invitedBy: inviter, expiresAt: new Date(Date.now() + 3600_000) });
  }
  return {};
}

export const tokenFor = (actor: string | undefined): { token: string } => ({ token: tokens.get(actor ?? "") ?? "signed-out-token-that-nobody-issued" });

/** After joining: the invitation is used, by this account. */
export async function joinedOnce(actor: string, userId: string): Promise<void> {
  const [row] = await db.select().from(invitations).where(eq(invitations.tokenHash, hashEmailToken(tokens.get(actor)!)));
  expect({ actor, acceptedBy: row?.acceptedBy }).toEqual({ actor, acceptedBy: userId });
}

/** GET /api/club-fields gave only fields of clubs the caller belongs to. */
export async function onlyOwnClubsFields(userId: string, res: Response): Promise<void> {
  const { fields } = (await res.json()) as { fields: { id: string }[] };
  if (fields.length === 0) return;
  const foreign = await db.execute(sql`
    select f.id from club_fields f where f.id in (${sql.join(fields.map((f) => sql`${f.id}::uuid`), sql`, `)})
      and not exists (select 1 from memberships m where m.club_id = f.club_id and m.user_id = ${userId})`);
  expect(foreign.rows).toEqual([]);
}

/** A field of the owner's club on which each actor opens a different day (so every officer's answer is a fresh 201). */
let dayField = "";
let dayCount = 0;
export async function fieldForDays(cast: Cast): Promise<Record<string, string>> {
  const club = await ownersClub(cast);
  const [field] = await db.insert(clubFields).values({ clubId: club.id, name: "Matrix Day Field" }).returning();
  dayField = field!.id;
  return { slug: club.slug };
}
export const nextDayBody = () => ({ fieldId: dayField, day: `2026-07-${String(1 + (dayCount++ % 28)).padStart(2, "0")}` });

/** The owner's club with a field day open on 2026-06-20 at a field of its own: the Day board's address. */
export async function dayOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const club = await ownersClub(cast);
  const [field] = await db.insert(clubFields).values({ clubId: club.id, name: "Matrix Board Field" }).returning();
  await db.insert(clubDays).values({ clubId: club.id, fieldId: field!.id, day: "2026-06-20", openedBy: cast.owner.id });
  return { slug: club.slug, date: "2026-06-20" };
}

/**
 * The owner's club with a field day on 2026-06-21 at which two of the owner's phones recorded one of
 * the owner's runs differently (one missed the last flight): the lane an officer decides on.
 */
let differentRun = "";
let differentDevice = "";
export async function dayWithDifference(cast: Cast): Promise<Record<string, string>> {
  const club = await ownersClub(cast);
  const [field] = await db.insert(clubFields).values({ clubId: club.id, name: "Matrix Decision Field" }).returning();
  await db.insert(clubDays).values({ clubId: club.id, fieldId: field!.id, day: "2026-06-21", openedBy: cast.owner.id });
  const a = await addPhone(cast.owner.id, 0, 40, "matrix-a");
  const b = await addPhone(cast.owner.id, 0, 40, "matrix-b");
  differentRun = await dayRun({
    creatorId: cast.owner.id, field: "Matrix Decision Field", at: "2026-06-21T10:00:00Z", pilots: [cast.owner.id],
    records: [{ phone: a, signals: true, lanes: { 0: [[5, 60], [70, 120]] } }, { phone: b, lanes: { 0: [[6, 61]] } }],
  });
  differentDevice = b.id;
  return { slug: club.slug, date: "2026-06-21" };
}
export const decisionBody = () => ({ runId: differentRun, lane: 0, deviceId: differentDevice, note: "Matrix decision" });

/** A run of the owner's (set up 2025-12-29, records.ts) and a day of the owner's club that day, which only the owner may choose for it. */
let choiceDay = "";
export async function runAndDayOfOwner(cast: Cast, insertOwnRun: () => Promise<string>): Promise<Record<string, string>> {
  const club = await ownersClub(cast);
  const [field] = await db.insert(clubFields).values({ clubId: club.id, name: "Matrix Choice Field" }).returning();
  const [day] = await db.insert(clubDays).values({ clubId: club.id, fieldId: field!.id, day: "2025-12-29", openedBy: cast.owner.id }).returning();
  choiceDay = day!.id;
  return { runId: await insertOwnRun() };
}
export const choiceBody = () => ({ dayId: choiceDay, chosen: true });

/** GET /api/runs/[runId]/club-days offers the day to the run's owner only; everyone else gets an empty list. */
export async function offersDayToOwnerOnly(actor: string, res: Response): Promise<void> {
  const { days } = (await res.json()) as { days: { dayId: string }[] };
  expect({ actor, offered: days.map((d) => d.dayId) }).toEqual({ actor, offered: actor === "owner" ? [choiceDay] : [] });
}

/** GET /api/runs/[runId]/day-decisions for a run no club decided: an empty list for every signed-in actor. */
export async function noDayDecisions(ctx: { actor: string }, res: Response): Promise<void> {
  expect({ actor: ctx.actor, body: await res.json() }).toEqual({ actor: ctx.actor, body: { decisions: [] } });
}

/**
 * An unused invitation of the owner's club, made again before each actor (a withdrawal deletes it):
 * the params function runs once, so the row is put back by id after every 2xx (`invitationReturns`).
 */
let withdrawn: typeof invitations.$inferInsert | null = null;
export async function invitationOfOwnersClub(cast: Cast): Promise<Record<string, string>> {
  const club = await ownersClub(cast);
  const { tokenHash } = newEmailToken();
  const [row] = await db.insert(invitations).values({ clubId: club.id, email: `matrix-withdraw-${randomUUID()}@example.com`, role: "member", tokenHash, invitedBy: cast.owner.id, expiresAt: new Date(Date.now() + 3600_000) }).returning();
  withdrawn = row!;
  return { slug: club.slug, invitationId: row!.id };
}

/** After a 2xx withdrawal: the invitation is gone; put it back (same id) for the next actor. */
export async function invitationReturns(): Promise<void> {
  expect(await db.select().from(invitations).where(eq(invitations.id, withdrawn!.id!))).toEqual([]);
  await db.insert(invitations).values(withdrawn!);
}
