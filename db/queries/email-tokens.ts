import "server-only";
import { and, eq, isNull, sql } from "drizzle-orm";
import type { Database } from "../index";
import { emailTokens, users } from "../schema";

export type TokenPurpose = "verify" | "reset" | "change-email";
export type TokenRow = typeof emailTokens.$inferSelect;

/** Stores a one-time link's hash. */
export async function createEmailToken(
  db: Database,
  input: { userId: string; purpose: TokenPurpose; tokenHash: string; expiresAt: Date; newEmail?: string },
): Promise<void> {
  await db.insert(emailTokens).values({ ...input, newEmail: input.newEmail ?? null });
}

export type TokenUse = { status: "ok"; token: TokenRow } | { status: "used" | "expired" | "unknown" };

/**
 * Uses a one-time link inside `tx`: the row is locked, checked (right purpose, not used, not expired,
 * its account not disabled) and marked used, so of two uses at once exactly one gets "ok". The caller
 * does what the link is for in the same transaction; if that throws, the link stays unused.
 */
export async function takeEmailToken(tx: Database, tokenHash: string, purpose: TokenPurpose): Promise<TokenUse> {
  const [row] = await tokenQuery(tx, tokenHash, purpose).for("update", { of: emailTokens });
  const use = judge(row);
  if (use.status === "ok") await tx.update(emailTokens).set({ usedAt: sql`now()` }).where(eq(emailTokens.id, use.token.id));
  return use;
}

/**
 * What using the link would answer now, without using it: lets a caller refuse a bad link before
 * expensive work (a password hash). takeEmailToken still decides, under its lock.
 */
export async function peekEmailToken(db: Database, tokenHash: string, purpose: TokenPurpose): Promise<TokenUse["status"]> {
  const [row] = await tokenQuery(db, tokenHash, purpose);
  return judge(row).status;
}

function tokenQuery(db: Database, tokenHash: string, purpose: TokenPurpose) {
  return db
    .select({ token: emailTokens, disabledAt: users.disabledAt })
    .from(emailTokens)
    .innerJoin(users, eq(users.id, emailTokens.userId))
    .where(and(eq(emailTokens.tokenHash, tokenHash), eq(emailTokens.purpose, purpose)))
    .$dynamic();
}

function judge(row: { token: TokenRow; disabledAt: Date | null } | undefined): TokenUse {
  if (!row || row.disabledAt) return { status: "unknown" };
  if (row.token.usedAt) return { status: "used" };
  if (row.token.expiresAt.getTime() <= Date.now()) return { status: "expired" };
  return { status: "ok", token: row.token };
}

/** Ends every unused link of this purpose for the account (a password reset ends the other reset links). */
export async function retireEmailTokens(tx: Database, userId: string, purpose: TokenPurpose): Promise<void> {
  await tx
    .update(emailTokens)
    .set({ usedAt: sql`now()` })
    .where(and(eq(emailTokens.userId, userId), eq(emailTokens.purpose, purpose), isNull(emailTokens.usedAt)));
}
