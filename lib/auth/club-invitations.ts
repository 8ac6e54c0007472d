import "server-only";
import { db } from "@/db";
import { createInvitation, peekInvitation, takeInvitation, type InvitationUse } from "@/db/queries/club-invitations";
import { ROLE_LABEL, type ClubRole } from "@/lib/clubs/roles";
import { AppError, ConflictError } from "@/lib/errors";
import { appLink } from "@/lib/mail/links";
import { clubInvitationMail } from "@/lib/mail/messages";
import { sendMail } from "@/lib/mail/server/send";
import { hashEmailToken, newEmailToken } from "./email-tokens";
import { INVITATION_LINK_MESSAGES, LinkError } from "./link-error";

/**
 * Club invitations by e-mail: a one-time link (256 random bits, only its SHA-256 stored, as for the
 * account links in email-tokens.ts) that works once, for INVITATION_DAYS. Whoever follows it signed
 * in joins with the invited role: the link is the credential, so an invitee may join with an
 * account under another address.
 */
export const INVITATION_DAYS = 7;

export async function inviteToClub(input: {
  club: { id: string; name: string };
  inviter: { id: string; name: string };
  email: string;
  role: ClubRole;
}): Promise<void> {
  const { token, tokenHash } = newEmailToken();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
  const made = await createInvitation(db, { clubId: input.club.id, email: input.email, role: input.role, tokenHash, invitedBy: input.inviter.id, expiresAt });
  if (!made) throw new ConflictError("already_member", "Someone with this e-mail address is already a member of the club.");
  const link = appLink("/join-club", { token });
  await sendMail(input.email, clubInvitationMail({ clubName: input.club.name, inviterName: input.inviter.name, roleLabel: ROLE_LABEL[input.role], link, days: INVITATION_DAYS }));
}

/** What the invitation page shows before the button is pressed (the link is not used by looking). */
export async function lookUpInvitation(token: string): Promise<InvitationUse> {
  return peekInvitation(db, hashEmailToken(token));
}

/** Uses the link: the signed-in account joins the club with the invited role. 410 used/expired, 404 unknown, 409 already a member. */
export async function acceptInvitation(token: string, userId: string): Promise<{ slug: string; clubName: string; role: ClubRole }> {
  const use = await db.transaction((tx) => takeInvitation(tx, { tokenHash: hashEmailToken(token), userId }));
  if (use.status === "member") throw new AppError("already_member", "You are already a member of this club. The link stays unused.", 409);
  if (use.status !== "ok") throw new LinkError(use.status, INVITATION_LINK_MESSAGES);
  return { slug: use.invitation.slug, clubName: use.invitation.clubName, role: use.invitation.role };
}
