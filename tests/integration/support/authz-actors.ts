import { eq } from "drizzle-orm";
import { clubs, coachGrants, memberships, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { MockSessionUser } from "./session";
import { db, demoUser, freshUser } from "./db";

/** Who knocks, in the authorisation matrix. */
export const ACTORS = ["signedOut", "owner", "otherPilot", "coachWithGrant", "coachWithoutGrant", "officerOtherClub", "admin"] as const;
export type Actor = (typeof ACTORS)[number];
export type Cast = Record<Exclude<Actor, "signedOut">, MockSessionUser>;

/** The password of every account the matrix creates itself. */
export const MATRIX_PASSWORD = "matrix-window-2026";

async function heronmoorId(): Promise<string> {
  const [club] = await db.select({ id: clubs.id }).from(clubs).where(eq(clubs.slug, "heronmoor"));
  if (!club) throw new Error("the demo club is missing: seed the test database (npm test does)");
  return club.id;
}

/** A fresh account that coaches in the demo club, with no grant from anyone. */
async function coachWithoutGrant(passwordHash?: string): Promise<MockSessionUser> {
  const coach = await freshUser("matrix-coach", { passwordHash });
  await db.insert(memberships).values({ clubId: await heronmoorId(), userId: coach.id, role: "coach" });
  return coach;
}

/** A fresh account that is an officer of a club of its own (not the demo club). */
async function officerOfOtherClub(passwordHash?: string): Promise<MockSessionUser> {
  const officer = await freshUser("matrix-officer", { passwordHash });
  const slug = `matrix-${officer.id.slice(0, 8)}`;
  const [club] = await db.insert(clubs).values({ name: "Matrix Test Club", slug }).returning();
  await db.insert(memberships).values({ clubId: club!.id, userId: officer.id, role: "officer" });
  return officer;
}

/**
 * The seeded cast: Ada owns the records, Tobi is another pilot, Mara coaches with Ada's grant;
 * the coach without a grant and the officer of another club are made here (the seed has neither).
 */
export async function seededCast(): Promise<Cast> {
  return {
    owner: await demoUser("ada@example.com"),
    otherPilot: await demoUser("tobi@example.com"),
    coachWithGrant: await demoUser("mara@example.com"),
    coachWithoutGrant: await coachWithoutGrant(),
    officerOtherClub: await officerOfOtherClub(),
    admin: await demoUser("admin@example.com"),
  };
}

/**
 * Fresh twins of the cast, each with MATRIX_PASSWORD, for rows that change or delete the caller's
 * own account (demo accounts must stay as they are for other tests).
 */
export async function freshCast(): Promise<Cast> {
  const passwordHash = await hashPassword(MATRIX_PASSWORD);
  const club = await heronmoorId();
  const owner = await freshUser("matrix-owner", { passwordHash });
  const otherPilot = await freshUser("matrix-pilot", { passwordHash });
  const coachWithGrant = await freshUser("matrix-granted", { passwordHash });
  await db.insert(memberships).values([
    { clubId: club, userId: owner.id, role: "member" },
    { clubId: club, userId: otherPilot.id, role: "member" },
    { clubId: club, userId: coachWithGrant.id, role: "coach" },
  ]);
  await db.insert(coachGrants).values({ pilotId: owner.id, coachId: coachWithGrant.id });
  const admin = await freshUser("matrix-admin", { passwordHash, role: "admin" });
  return {
    owner, otherPilot, coachWithGrant,
    coachWithoutGrant: await coachWithoutGrant(passwordHash),
    officerOtherClub: await officerOfOtherClub(passwordHash),
    admin,
  };
}

/** The account row as it is now (to check what a request did to it). */
export async function accountRow(id: string) {
  const [row] = await db.select().from(users).where(eq(users.id, id));
  return row;
}
