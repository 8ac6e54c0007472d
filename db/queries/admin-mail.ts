import "server-only";
import { eq, sql } from "drizzle-orm";
import { canRetryMail } from "@/lib/admin/mail-state";
import type { Database } from "../index";
import { adminActions, mailQueue } from "../schema";

export type MailRetryOutcome = "retried" | "not-found" | "not-failed";

/**
 * Makes a failed message due again at once with a fresh count of attempts (the drain had given up, or
 * waits out its backoff), as `actorId`, with its audit entry (the attempts it had), in one transaction.
 * A message that was sent or never failed is left as it is ("not-failed").
 */
export async function retryMail(db: Database, params: { actorId: string; mailId: string }): Promise<MailRetryOutcome> {
  return db.transaction(async (tx) => {
    const [mail] = await tx
      .select({ sentAt: mailQueue.sentAt, nextAttemptAt: mailQueue.nextAttemptAt, lastError: mailQueue.lastError, attempts: mailQueue.attempts })
      .from(mailQueue)
      .where(eq(mailQueue.id, params.mailId))
      .for("update");
    if (!mail) return "not-found";
    if (!canRetryMail(mail)) return "not-failed";
    await tx.update(mailQueue).set({ attempts: 0, nextAttemptAt: sql`now()` }).where(eq(mailQueue.id, params.mailId));
    await tx.insert(adminActions).values({ actorId: params.actorId, action: "mail.retry", targetMailId: params.mailId, detail: { attempts: mail.attempts } });
    return "retried";
  });
}
