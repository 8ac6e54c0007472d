/**
 * Whether a session token still speaks for its account. Tokens are signed cookies that live for
 * 30 days, so the account is read from the database on every request and the token is honoured
 * only while the account exists, is not disabled and has not moved to a newer session generation
 * (a password change, "sign out everywhere" or deletion bumps it).
 */
export type SessionAccountFacts = { disabledAt: Date | null; sessionVersion: number };

export type SessionVerdict = "current" | "gone" | "disabled" | "stale";

/** The verdict for a token issued under `tokenVersion` (tokens from before generations count as 0). */
export function sessionVerdict(account: SessionAccountFacts | undefined, tokenVersion: number | undefined): SessionVerdict {
  if (!account) return "gone";
  if (account.disabledAt) return "disabled";
  return account.sessionVersion === (tokenVersion ?? 0) ? "current" : "stale";
}

/** Thrown inside next-auth's jwt callback so next-auth clears the cookie and answers "signed out". */
export class SessionRevokedError extends Error {
  constructor(readonly verdict: Exclude<SessionVerdict, "current">) {
    super("session_revoked");
    this.name = "SessionRevokedError";
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A token's account id must be a uuid before it reaches a uuid column (anything else is signed out). */
export function isAccountId(id: unknown): id is string {
  return typeof id === "string" && UUID.test(id);
}
