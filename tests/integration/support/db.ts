import { eq } from "drizzle-orm";
import { db, getPool } from "@/db";
import { users } from "@/db/schema";

/**
 * Integration tests run against the real PostgreSQL test database that `npm test` creates,
 * migrates and seeds (DATABASE_URL points at it).
 */
export { db, getPool };

/** A seeded demo user as a session user. */
export async function demoUser(email: string) {
  const [u] = await db.select().from(users).where(eq(users.email, email));
  if (!u) throw new Error(`demo user ${email} missing: run the tests through npm test (it seeds the test database)`);
  return { id: u.id, email: u.email, name: u.name, role: u.role, sessionVersion: u.sessionVersion };
}

/**
 * A fresh account of this test's own (unique e-mail), as a session user holding a token of the
 * account's current generation. Tests that delete, disable or sign out an account use one of these,
 * never a demo account other tests act as.
 */
export async function freshUser(label: string, input: { role?: "member" | "admin"; passwordHash?: string; verified?: boolean } = {}) {
  const email = `${label}-${Date.now()}-${Math.random().toString(36).slice(2, 8)}@example.com`;
  const [u] = await db
    .insert(users)
    .values({ email, name: `Test ${label}`, role: input.role ?? "member", passwordHash: input.passwordHash ?? null, emailVerifiedAt: input.verified ? new Date() : null })
    .returning();
  return { id: u!.id, email: u!.email, name: u!.name, role: u!.role, sessionVersion: u!.sessionVersion };
}

/** A fresh account whose address is verified (offers made to an address reach only its verified holder). */
export const verifiedUser = (label: string, input: { role?: "member" | "admin"; passwordHash?: string } = {}) => freshUser(label, { ...input, verified: true });
