import "server-only";
import { and, asc, count, ilike, isNull, or, type SQL } from "drizzle-orm";
import type { Database } from "../index";
import { users } from "../schema";

export const USERS_PAGE_SIZE = 20;

/** An account as the admin's user list shows it (no password hash, no session generation). */
export type AdminUserRow = {
  id: string; email: string; name: string; role: "member" | "admin";
  disabledAt: Date | null; emailVerifiedAt: Date | null; createdAt: Date;
};

/** `%`, `_` and `\` match literally in the search (PostgreSQL's LIKE escapes with a backslash). */
const likeLiteral = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/**
 * Accounts whose e-mail or name contains `q` (any case; empty = all), ordered by e-mail, one page of
 * USERS_PAGE_SIZE, with the number of matches. Deleted accounts (anonymous tombstones) are left out.
 */
export async function searchUsers(db: Database, params: { q: string; page: number }) {
  const filters: SQL[] = [isNull(users.deletedAt)];
  if (params.q) {
    const pattern = `%${likeLiteral(params.q)}%`;
    filters.push(or(ilike(users.email, pattern), ilike(users.name, pattern))!);
  }
  const where = and(...filters);
  const rows: AdminUserRow[] = await db
    .select({
      id: users.id, email: users.email, name: users.name, role: users.role,
      disabledAt: users.disabledAt, emailVerifiedAt: users.emailVerifiedAt, createdAt: users.createdAt,
    })
    .from(users)
    .where(where)
    .orderBy(asc(users.email))
    .limit(USERS_PAGE_SIZE)
    .offset((params.page - 1) * USERS_PAGE_SIZE);
  const [total] = await db.select({ n: count() }).from(users).where(where);
  return { users: rows, total: total?.n ?? 0, page: params.page, pageSize: USERS_PAGE_SIZE };
}
