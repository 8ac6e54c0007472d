/** Where a queued message stands, for the admin's view of the e-mail queue (db/schema/mail.ts). */
export type MailState = "sent" | "queued" | "retrying" | "failed";

export type MailFacts = { sentAt: Date | null; nextAttemptAt: Date | null; lastError: string | null };

/**
 * sent: delivered to the mail server; failed: the drain gave up (no next try); retrying: the last try
 * failed and another is scheduled; queued: not tried yet, or claimed by a drain right now.
 */
export function mailState(m: MailFacts): MailState {
  if (m.sentAt) return "sent";
  if (!m.nextAttemptAt) return "failed";
  return m.lastError ? "retrying" : "queued";
}

/** An admin may send a message again when its last try failed (given up, or waiting for the next try). */
export function canRetryMail(m: MailFacts): boolean {
  const state = mailState(m);
  return state === "failed" || state === "retrying";
}
