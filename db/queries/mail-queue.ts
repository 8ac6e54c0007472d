import "server-only";
import { and, asc, eq, isNull, lte, sql } from "drizzle-orm";
import type { Database } from "../index";
import { mailQueue } from "../schema";

export type QueuedMail = typeof mailQueue.$inferSelect;
export type NewMail = Pick<QueuedMail, "to" | "subject" | "text" | "html" | "kind">;

/** Puts a message in the queue, due at once; returns its id. */
export async function enqueueMail(db: Database, mail: NewMail): Promise<string> {
  const [row] = await db.insert(mailQueue).values(mail).returning({ id: mailQueue.id });
  return row!.id;
}

/**
 * Claims up to `limit` due messages for one sender: their next attempt moves `leaseMs` ahead and their
 * attempt count goes up, in one statement that skips rows another drain holds (FOR UPDATE SKIP LOCKED),
 * so two drains (two requests' after(), the interval) never send one message twice. A sender that dies
 * mid-send leaves the row due again when the lease runs out. Messages past `maxAttempts` stay unsent.
 */
export async function claimDueMail(db: Database, opts: { limit: number; leaseMs: number; maxAttempts: number }): Promise<QueuedMail[]> {
  const due = db
    .select({ id: mailQueue.id })
    .from(mailQueue)
    .where(and(isNull(mailQueue.sentAt), lte(mailQueue.nextAttemptAt, sql`now()`), sql`${mailQueue.attempts} < ${opts.maxAttempts}`))
    .orderBy(asc(mailQueue.nextAttemptAt))
    .limit(opts.limit)
    .for("update", { skipLocked: true });
  return db
    .update(mailQueue)
    .set({ attempts: sql`${mailQueue.attempts} + 1`, nextAttemptAt: sql`now() + ${opts.leaseMs} * interval '1 millisecond'` })
    .where(sql`${mailQueue.id} in ${due}`)
    .returning();
}

export async function markMailSent(db: Database, id: string): Promise<void> {
  await db.update(mailQueue).set({ sentAt: sql`now()`, lastError: null, nextAttemptAt: null }).where(eq(mailQueue.id, id));
}

/** Records a failed send; the message is due again after `retryInMs`, or never (null) when it gave up. */
export async function markMailFailed(db: Database, id: string, error: string, retryInMs: number | null): Promise<void> {
  await db
    .update(mailQueue)
    .set({
      lastError: error.slice(0, 1000),
      nextAttemptAt: retryInMs === null ? null : sql`now() + ${retryInMs} * interval '1 millisecond'`,
    })
    .where(eq(mailQueue.id, id));
}

/** The messages queued for an address, newest first (tests and, later, the admin's queue view). */
export async function listMailTo(db: Database, to: string): Promise<QueuedMail[]> {
  return db.select().from(mailQueue).where(eq(mailQueue.to, to)).orderBy(sql`${mailQueue.createdAt} desc`);
}
