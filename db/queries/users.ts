import "server-only";
import { eq, sql } from "drizzle-orm";
import type { Database } from "../index";
import { memberships, signInThrottles, users } from "../schema";

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

const WINDOW_MINUTES = 15;

/** True while the key is locked out after too many failures. */
export async function isThrottled(db: Database, key: string): Promise<boolean> {
  const [row] = await db
    .select({ lockedUntil: signInThrottles.lockedUntil })
    .from(signInThrottles)
    .where(eq(signInThrottles.key, key));
  return !!row?.lockedUntil && row.lockedUntil.getTime() > Date.now();
}

/** Counts a failure; the `limit`-th failure within the window locks the key for the window. */
export async function recordSignInFailure(db: Database, key: string, limit: number): Promise<void> {
  const window = sql.raw(`interval '${WINDOW_MINUTES} minutes'`);
  await db.execute(sql`
    insert into sign_in_throttles (key, failures, window_started_at) values (${key}, 1, now())
    on conflict (key) do update set
      failures = case when sign_in_throttles.window_started_at < now() - ${window} then 1
                      else sign_in_throttles.failures + 1 end,
      window_started_at = case when sign_in_throttles.window_started_at < now() - ${window} then now()
                               else sign_in_throttles.window_started_at end,
      locked_until = case when sign_in_throttles.window_started_at >= now() - ${window}
                            and sign_in_throttles.failures + 1 >= ${limit} then now() + ${window}
                          else sign_in_throttles.locked_until end`);
}

/** A successful sign-in clears the key's failures. */
export async function clearSignInFailures(db: Database, key: string): Promise<void> {
  await db.delete(signInThrottles).where(eq(signInThrottles.key, key));
}
