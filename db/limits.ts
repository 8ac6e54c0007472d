import "server-only";
import { RateLimiterPostgres } from "rate-limiter-flexible";
import { getPool } from "./index";

const HOUR = 3600;
const DAY = 24 * HOUR;

/**
 * The attempt limiters, each a rate-limiter-flexible `RateLimiterPostgres` on the one pool, all in
 * the `rate_limits` table (made by a migration, so `tableCreated`; keys carry the limiter's prefix).
 * The numbers live here; the policy that uses them is lib/auth/attempts.ts (README: "What is protected").
 */
function make(keyPrefix: string, points: number, duration: number): RateLimiterPostgres {
  return new RateLimiterPostgres({ storeClient: getPool(), tableName: "rate_limits", tableCreated: true, keyPrefix, points, duration });
}

function build() {
  return {
    /** Attempts per (account, address) that pass without delay since that pair's last success. */
    pairFree: make("pair-free", 2, DAY),
    /** One attempt per window after the free ones; the window grows with `pairSteps` (customDuration). */
    pairGate: make("pair-gate", 1, 60),
    /** How many gated attempts a pair has had: the exponent of its next delay. */
    pairSteps: make("pair-steps", 1_000_000, DAY),
    /** Failures per account from any address; past the points the account is "under attack". */
    accountFailures: make("account-fail", 20, DAY),
    /** Failures per address across accounts (only for addresses we can see, see client-address.ts). */
    addressFailures: make("address-fail", 300, DAY),
    /** Sign-ups per address. */
    signUps: make("sign-up", 30, HOUR),
    /** Sign-ups of all callers together when no address is visible (TRUST_PROXY unset): each costs an argon2id hash. */
    signUpsUnseen: make("sign-up-unseen", 300, HOUR),
    /** Pushes per account: a phone pushes every few seconds at most; this is far above that. */
    pushes: make("push", 120, 60),
    /** Password-reset requests per address, and of all callers together when no address is visible. */
    resetRequests: make("reset-address", 10, HOUR),
    resetRequestsUnseen: make("reset-unseen", 100, HOUR),
    /** Password-reset requests per typed address (account or not): at most 5 reset e-mails an hour to one inbox. */
    resetAccount: make("reset-account", 5, HOUR),
    /** Account e-mails a signed-in user asks for (verification again, e-mail change): 5 an hour. */
    accountMail: make("account-mail", 5, HOUR),
    /** Club invitations an officer sends: 50 an hour (a whole club at once), and 3 an hour to one address. */
    invitations: make("invitations", 50, HOUR),
    invitationsTo: make("invitations-to", 3, HOUR),
    /** One-time coach codes typed in: 10 an hour per account, 60 an hour per address (nobody guesses codes). */
    coachClaims: make("coach-claims", 10, HOUR),
    coachClaimsFrom: make("coach-claims-from", 60, HOUR),
    /** Offers of one's season (e-mail or one-time code): 20 an hour per account; every open code is one more a guesser could hit. */
    coachOffers: make("coach-offers", 20, HOUR),
  };
}

export type Limiters = ReturnType<typeof build>;

const cache = globalThis as unknown as { windowcallLimiters?: Limiters };

/** The limiters of the process, made on first use (the build imports modules without a database). */
export function getLimiters(): Limiters {
  return (cache.windowcallLimiters ??= build());
}
