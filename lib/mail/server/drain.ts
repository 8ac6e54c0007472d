import "server-only";
import { db } from "@/db";
import { claimDueMail, markMailFailed, markMailSent } from "@/db/queries/mail-queue";
import { MAX_MAIL_ATTEMPTS, retryDelayMs } from "../backoff";
import { mailFrom, mailTransport } from "./transport";

const LEASE_MS = 5 * 60_000;
const BATCH = 20;

/**
 * Sends what is due in the queue (db/queries/mail-queue.ts), batch by batch, until nothing is due.
 * Each message is claimed first (so a parallel drain skips it), then sent; a failure records the error
 * and schedules the next try (backoff.ts). Never throws: a request or timer that drains never fails
 * because of mail. Returns how many were sent.
 */
export async function drainMailQueue(): Promise<number> {
  const transport = mailTransport();
  if (!transport) return 0;
  let sent = 0;
  try {
    for (let round = 0; round < 50; round++) {
      const batch = await claimDueMail(db, { limit: BATCH, leaseMs: LEASE_MS, maxAttempts: MAX_MAIL_ATTEMPTS });
      if (!batch.length) break;
      for (const mail of batch) {
        try {
          await transport.sendMail({ from: mailFrom(), to: mail.to, subject: mail.subject, text: mail.text, html: mail.html });
          await markMailSent(db, mail.id);
          sent++;
        } catch (error) {
          await markMailFailed(db, mail.id, error instanceof Error ? error.message : String(error), retryDelayMs(mail.attempts));
        }
      }
    }
  } catch (error) {
    console.error("[mail] drain stopped", error instanceof Error ? error.message : error);
  }
  return sent;
}
