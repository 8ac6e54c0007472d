import { appLink } from "@/lib/mail/links";
import { emailChangedMail } from "@/lib/mail/messages";
import { MAX_MAIL_ATTEMPTS } from "@/lib/mail/backoff";
import type { Tx } from "../queries/sync-db";
import { adminActions, mailQueue, syncRejections, users } from "../schema";

/**
 * Something for /admin to show on a fresh demo: a message the mail queue gave up on (the mail server
 * was down), an item a phone pushed that the server refused, and an account the admin disabled (with
 * its audit entry). Every name and address is invented.
 */
export async function seedAdminDemo(tx: Tx, p: { adminId: string; pilotId: string; pilotEmail: string; passwordHash: string; at: number }) {
  const at = (hoursAfter: number) => new Date(p.at + hoursAfter * 3600_000);
  await tx.insert(mailQueue).values({
    to: p.pilotEmail,
    ...emailChangedMail({ newEmail: p.pilotEmail, resetLink: appLink("/forgot-password") }),
    attempts: MAX_MAIL_ATTEMPTS,
    nextAttemptAt: null,
    lastError: "connect ECONNREFUSED 127.0.0.1:587",
    createdAt: at(0),
  });
  await tx.insert(syncRejections).values({
    itemId: "0190f3a2-7c41-7d2e-9b1a-5e8c2d4f6a10",
    deviceId: "demo-phone-lena",
    userId: p.pilotId,
    reason: "You already have 200 runs on that day, the most one account may record per day.",
    createdAt: at(2),
  });
  const [disabled] = await tx
    .insert(users)
    .values({ email: "noor@example.com", name: "Noor Halloway", passwordHash: p.passwordHash, disabledAt: at(3), sessionVersion: 1, createdAt: at(-24) })
    .returning({ id: users.id });
  await tx.insert(adminActions).values({ actorId: p.adminId, action: "user.disable", targetUserId: disabled!.id, createdAt: at(3) });
}
