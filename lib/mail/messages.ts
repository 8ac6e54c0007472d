import { compose, type Mail } from "./layout";

/**
 * Every message the app sends, built from plain data (pure). All of these are transactional (about
 * the reader's own account), so none carries an unsubscribe line; see layout.ts for those that do.
 */

export function verifyEmailMail(input: { name: string; link: string }): Mail {
  return compose("verify-email", "Confirm your e-mail address", [
    `Hello ${input.name},`,
    "Welcome to Windowcall. Please confirm that this is your e-mail address, so you can reset your password if you ever forget it:",
    { link: input.link, label: "Confirm my e-mail address" },
    "The link works once, for 48 hours. Your account works already; if you did not create it, ignore this message.",
  ]);
}

/** To the owner of an address someone tried to sign up with: nothing was changed. */
export function signUpAttemptMail(input: { resetLink: string }): Mail {
  return compose("sign-up-attempt", "Someone tried to create an account with your address", [
    "Someone (perhaps you) tried to create a Windowcall account with this e-mail address. You already have an account, so nothing was created and nothing in your account changed.",
    "If it was you and you forgot your password, you can choose a new one:",
    { link: input.resetLink, label: "Reset my password" },
    "If it was not you, you need not do anything.",
  ]);
}

export function resetPasswordMail(input: { link: string; minutes: number }): Mail {
  return compose("reset-password", "Reset your password", [
    "Someone (we hope you) asked to reset the password of the Windowcall account with this e-mail address.",
    { link: input.link, label: "Choose a new password" },
    `The link works once, for ${input.minutes} minutes. Choosing a new password signs your account out on every other phone and browser. If you did not ask, ignore this message: your password stays as it is.`,
  ]);
}

/** To the new address of an e-mail change: the change happens only when this link is followed. */
export function confirmNewEmailMail(input: { name: string; newEmail: string; link: string }): Mail {
  return compose("confirm-new-email", "Confirm your new e-mail address", [
    `Hello ${input.name},`,
    `You asked to change the e-mail address of your Windowcall account to ${input.newEmail}. Confirm it here:`,
    { link: input.link, label: "Confirm my new address" },
    "The link works once, for 24 hours. Until then your account keeps its old address.",
  ]);
}

/** To the old address once an e-mail change is confirmed. */
export function emailChangedMail(input: { newEmail: string; resetLink: string }): Mail {
  return compose("email-changed", "Your e-mail address was changed", [
    `The e-mail address of your Windowcall account was changed to ${input.newEmail}. You will sign in with the new address from now on.`,
    "If you did not do this, someone may know your password. Reset it from the sign-in page and tell your club:",
    { link: input.resetLink, label: "Reset my password" },
  ]);
}

/**
 * An officer's invitation to join a club. Sent once, because a person asked for it, to the one
 * address they typed: a transactional message, so no unsubscribe line (like the account links).
 */
export function clubInvitationMail(input: { clubName: string; inviterName: string; roleLabel: string; link: string; days: number }): Mail {
  return compose("club-invitation", `Join ${input.clubName}`, [
    `${input.inviterName} invites you to join ${input.clubName} on Windowcall as ${input.roleLabel.toLowerCase()}.`,
    "Open the link, sign in (or create an account, with any address) and press Join:",
    { link: input.link, label: `Join ${input.clubName}` },
    `The link works once, for ${input.days} days. If you do not know this club, ignore this message: nothing happens until the link is used.`,
  ]);
}

/**
 * A field day's summary, to the club's members who asked for it (a club setting of theirs). Not
 * transactional: it ends with the unsubscribe line, a link to the club page where the setting is.
 */
export function daySummaryMail(input: { clubName: string; dayText: string; lines: string[]; boardLink: string; unsubscribe: string }): Mail {
  return compose(
    "day-summary",
    `${input.clubName}: the field day of ${input.dayText}`,
    [`The field day of ${input.dayText} at ${input.clubName} is closed. What the club's phones recorded:`, ...input.lines, { link: input.boardLink, label: "Open the Day board" }],
    { unsubscribe: input.unsubscribe },
  );
}

/**
 * The day's summary again, after an officer decided a lane once the day was closed (its first summary
 * went at the close): what changed first, then the summary as it is now. To the same members, with the
 * same unsubscribe line.
 */
export function daySummaryUpdateMail(input: { clubName: string; dayText: string; change: string; lines: string[]; boardLink: string; unsubscribe: string }): Mail {
  return compose(
    "day-summary-update",
    `${input.clubName}: the field day of ${input.dayText}, updated`,
    [
      `An officer changed a result of the field day of ${input.dayText} at ${input.clubName} after it was closed.`,
      input.change,
      "The day's summary as it is now:",
      ...input.lines,
      { link: input.boardLink, label: "Open the Day board" },
    ],
    { unsubscribe: input.unsubscribe },
  );
}
