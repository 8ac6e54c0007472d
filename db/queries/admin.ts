import "server-only";
import { asc } from "drizzle-orm";
import type { Database } from "../index";
import { users } from "../schema";

/** Every account, for site administration (no password hashes). */
export async function listUsers(db: Database) {
  return db
    .select({ id: users.id, email: users.email, name: users.name, role: users.role, createdAt: users.createdAt })
    .from(users)
    .orderBy(asc(users.email));
}
