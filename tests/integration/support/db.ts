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
  return { id: u.id, email: u.email, name: u.name, role: u.role };
}
