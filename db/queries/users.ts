import "server-only";
import { and, eq, sql, type SQL } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import type { Database } from "../index";
import { memberships, users } from "../schema";

export type UserRow = typeof users.$inferSelect;

/** The user with this (lower-case) e-mail, or undefined. */
export async function getUserByEmail(db: Database, email: string): Promise<UserRow | undefined> {
  const [row] = await db.select().from(users).where(eq(users.email, email)).limit(1);
  return row;
}

export async function getUserById(db: Database, id: string): Promise<UserRow | undefined> {
  const [row] = await db.select().from(users).where(eq(users.id, id)).limit(1);
  return row;
}

/** Creates a user; returns undefined when the e-mail is taken (nothing changes then). */
export async function createUser(
  db: Database,
  input: { email: string; name: string; passwordHash: string },
): Promise<UserRow | undefined> {
  const [row] = await db.insert(users).values(input).onConflictDoNothing({ target: users.email }).returning();
  return row;
}

/** The user's club roles, club id → role. */
export async function listClubRoles(db: Database, userId: string) {
  return db
    .select({ clubId: memberships.clubId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.userId, userId));
}

/** Upgrades a user's password hash (bcrypt → argon2id at sign-in), unless it changed meanwhile. */
export async function upgradePasswordHash(db: Database, id: string, from: string, to: string): Promise<void> {
  await db.update(users).set({ passwordHash: to }).where(and(eq(users.id, id), eq(users.passwordHash, from)));
}

/** What a session needs to know about its account, read fresh on every request (no password hash). */
export type SessionAccount = Pick<UserRow, "id" | "email" | "name" | "role" | "disabledAt" | "sessionVersion">;

/** The account behind a session token, or undefined when it no longer exists. */
export async function getSessionAccount(db: Database, id: string): Promise<SessionAccount | undefined> {
  const [row] = await db
    .select({
      id: users.id, email: users.email, name: users.name, role: users.role,
      disabledAt: users.disabledAt, sessionVersion: users.sessionVersion,
    })
    .from(users)
    .where(eq(users.id, id))
    .limit(1);
  return row;
}

/** Signs out every session of the account (tokens carry the old generation); returns the new generation. */
export async function bumpSessionVersion(db: Database, userId: string): Promise<number | undefined> {
  const [row] = await db
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId))
    .returning({ sessionVersion: users.sessionVersion });
  return row?.sessionVersion;
}

/** Replaces the password hash and signs out every session of the account, in one statement. */
export async function updatePassword(db: Database, userId: string, passwordHash: string): Promise<number | undefined> {
  const [row] = await db
    .update(users)
    .set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId))
    .returning({ sessionVersion: users.sessionVersion });
  return row?.sessionVersion;
}

/** Marks the account's address verified, if it is still `email` (a link sent to an older address verifies nothing). */
export async function markEmailVerified(db: Database, userId: string, email: string): Promise<boolean> {
  const rows = await db
    .update(users)
    .set({ emailVerifiedAt: sql`coalesce(${users.emailVerifiedAt}, now())` })
    .where(and(eq(users.id, userId), eq(users.email, email)))
    .returning({ id: users.id });
  return rows.length > 0;
}

/** Whether the account's address is verified, for Settings. */
export async function getEmailState(db: Database, userId: string): Promise<{ email: string; verified: boolean } | undefined> {
  const [row] = await db.select({ email: users.email, verifiedAt: users.emailVerifiedAt }).from(users).where(eq(users.id, userId));
  return row && { email: row.email, verified: row.verifiedAt !== null };
}

/**
 * Moves the account to a confirmed new address (verified, since its owner followed a link sent there).
 * Returns the old address, or "taken" when another account holds the new one (nothing changes then).
 */
export async function changeEmail(db: Database, userId: string, newEmail: string): Promise<{ oldEmail: string } | "taken" | undefined> {
  const [taken] = await db.select({ id: users.id }).from(users).where(eq(users.email, newEmail));
  if (taken) return taken.id === userId ? undefined : "taken";
  const [before] = await db.select({ email: users.email }).from(users).where(eq(users.id, userId)).for("update");
  if (!before) return undefined;
  try {
    await db.update(users).set({ email: newEmail, emailVerifiedAt: sql`now()` }).where(eq(users.id, userId));
  } catch (error) {
    if ((error as { cause?: { code?: string }; code?: string }).cause?.code === "23505" || (error as { code?: string }).code === "23505") return "taken";
    throw error;
  }
  return { oldEmail: before.email };
}

/**
 * SQL: the account `userId` holds the address in `emailColumn` AND has verified it. Offers made to
 * an address (a model for sale, a coach's access) reach only its verified holder: anyone can sign up
 * with someone else's address, and must not take what was meant for its owner.
 */
export function holdsVerifiedAddress(userId: string, emailColumn: AnyPgColumn): SQL {
  return sql`exists (select 1 from ${users} where ${users.id} = ${userId} and ${users.emailVerifiedAt} is not null and lower(${users.email}) = ${emailColumn})`;
}
