import { AppError } from "@/lib/errors";

/** Why a one-time link from an e-mail was refused. */
export type LinkRefusal = "used" | "expired" | "unknown";

/** What the user reads for each refusal: the wording names the kind of link and who gives a new one. */
export type LinkMessages = Record<LinkRefusal, string>;

/** Account links (verify, reset, change of address). */
export const ACCOUNT_LINK_MESSAGES: LinkMessages = {
  used: "This link was already used. Each link works once: ask for a new one if you need it.",
  expired: "This link has expired. Ask for a new one.",
  unknown: "This link is not valid. Open the link from the e-mail again, or ask for a new one.",
};

/** Club invitations. */
export const INVITATION_LINK_MESSAGES: LinkMessages = {
  used: "This invitation was already used. Each invitation works once: ask the club's officer for a new one if you need it.",
  expired: "This invitation has expired. Ask the club's officer for a new one.",
  unknown: "This invitation link is not valid. Open the link from the e-mail again, or ask the club's officer for a new one.",
};

/** A refused one-time link: 410 when used or expired, 404 when unknown (code `link_<refusal>`). */
export class LinkError extends AppError {
  constructor(refusal: LinkRefusal, messages: LinkMessages = ACCOUNT_LINK_MESSAGES) {
    super(`link_${refusal}`, messages[refusal], refusal === "unknown" ? 404 : 410);
  }
}
