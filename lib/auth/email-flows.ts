import "server-only";
import { db } from "@/db";
import { createEmailToken, peekEmailToken, retireEmailTokens, takeEmailToken, type TokenPurpose } from "@/db/queries/email-tokens";
import { changeEmail, getUserByEmail, markEmailVerified, updatePassword } from "@/db/queries/users";
import { appLink } from "@/lib/mail/links";
import { confirmNewEmailMail, emailChangedMail, resetPasswordMail, signUpAttemptMail, verifyEmailMail } from "@/lib/mail/messages";
import { sendMail } from "@/lib/mail/server/send";
import { hashEmailToken, newEmailToken, TOKEN_TTL_MS } from "./email-tokens";
import { AppError } from "@/lib/errors";
import { LinkError } from "./link-error";
import { hashPassword } from "./password";

/**
 * The account flows that go through e-mail. Each link is a one-time token (email-tokens.ts) whose hash
 * is stored; using one locks it, checks it and does the change in one transaction.
 */

async function issue(userId: string, purpose: TokenPurpose, email: string): Promise<string> {
  const { token, tokenHash } = newEmailToken();
  await createEmailToken(db, { userId, purpose, tokenHash, expiresAt: new Date(Date.now() + TOKEN_TTL_MS[purpose]), newEmail: email });
  return token;
}

/** After a sign-up: a link that verifies this address. */
export async function sendVerification(user: { id: string; email: string; name: string }): Promise<void> {
  const token = await issue(user.id, "verify", user.email);
  await sendMail(user.email, verifyEmailMail({ name: user.name, link: appLink("/verify-email", { token }) }));
}

/** A sign-up with a taken address: tell its owner (nothing changed), with a way to a new password. */
export async function sendSignUpAttempt(email: string): Promise<void> {
  await sendMail(email, signUpAttemptMail({ resetLink: appLink("/forgot-password", { email }) }));
}

/** A reset link to the account with this address, if there is one that may sign in; else nothing. */
export async function sendPasswordReset(email: string): Promise<void> {
  const user = await getUserByEmail(db, email);
  if (!user || user.disabledAt) return;
  const token = await issue(user.id, "reset", user.email);
  await sendMail(user.email, resetPasswordMail({ link: appLink("/reset-password", { token }), minutes: TOKEN_TTL_MS.reset / 60_000 }));
}

/** To the new address: the change happens when its link is followed. */
export async function sendEmailChange(user: { id: string; name: string }, newEmail: string): Promise<void> {
  const token = await issue(user.id, "change-email", newEmail);
  await sendMail(newEmail, confirmNewEmailMail({ name: user.name, newEmail, link: appLink("/confirm-email", { token }) }));
}

/** Uses a link: returns its row, or throws LinkError (410 used or expired, 404 unknown). */
async function take(tx: typeof db, token: string, purpose: TokenPurpose) {
  const use = await takeEmailToken(tx, hashEmailToken(token), purpose);
  if (use.status !== "ok") throw new LinkError(use.status);
  return use.token;
}

export async function verifyEmail(token: string): Promise<void> {
  await db.transaction(async (tx) => {
    const row = await take(tx, token, "verify");
    if (!(await markEmailVerified(tx, row.userId, row.newEmail ?? ""))) throw new LinkError("unknown");
  });
}

/**
 * Sets the new password, ends every session of the account and every other reset link. A link that
 * is not valid is refused before the password is hashed, so strangers cannot buy argon2 work with it.
 */
export async function resetPassword(token: string, password: string): Promise<void> {
  const seen = await peekEmailToken(db, hashEmailToken(token), "reset");
  if (seen !== "ok") throw new LinkError(seen);
  const passwordHash = await hashPassword(password);
  await db.transaction(async (tx) => {
    const row = await take(tx, token, "reset");
    if ((await updatePassword(tx, row.userId, passwordHash)) === undefined) throw new LinkError("unknown");
    await retireEmailTokens(tx, row.userId, "reset");
    await markEmailVerified(tx, row.userId, row.newEmail ?? ""); // the link reached this inbox
  });
}

/** Moves the account to the confirmed address and tells the old one. */
export async function confirmEmailChange(token: string): Promise<{ newEmail: string }> {
  const done = await db.transaction(async (tx) => {
    const row = await take(tx, token, "change-email");
    const changed = await changeEmail(tx, row.userId, row.newEmail ?? "");
    if (changed === "taken") throw new AppError("email_taken", "Another account uses this address now, so the change cannot be made.", 409);
    if (!changed) throw new LinkError("unknown");
    await retireEmailTokens(tx, row.userId, "change-email");
    return { oldEmail: changed.oldEmail, newEmail: row.newEmail ?? "" };
  });
  await sendMail(done.oldEmail, emailChangedMail({ newEmail: done.newEmail, resetLink: appLink("/forgot-password", { email: done.oldEmail }) }));
  return { newEmail: done.newEmail };
}
