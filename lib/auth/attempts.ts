import "server-only";
import { RateLimiterRes, type RateLimiterPostgres } from "rate-limiter-flexible";
import { getLimiters } from "@/db/limits";
import { accountKey } from "./known-device";

/**
 * Sign-in attempt limits (README: "What is protected and how"). Every attempt is counted BEFORE the
 * password is checked, so guesses sent at once cannot race past a limit; a success gives the counts back.
 *
 * - **Per (account, address)**: two attempts pass freely, the third opens a one-minute gate and each
 *   later one waits for the gate, which doubles (1, 2, 4 … 30 minutes). One atomic upsert decides who
 *   passes a gate, so of many guesses sent at once exactly one does. A success clears the pair.
 * - **Per address** (only one we can see, client-address.ts): 300 failures a day across accounts, far
 *   above a club of dozens behind one phone's hotspot mistyping now and then.
 * - **Per account**: past 20 failures a day from anywhere the account is under attack: addresses that
 *   already failed for it are refused until the day is out, but an address with no failure for it still
 *   gets through, so the owner is never locked out by a stranger elsewhere.
 *
 * Without a visible address (TRUST_PROXY unset) all requests share one pair per account, so only the
 * pair's growing delays apply: a stranger can slow an account down but never shut out other accounts.
 * - **Per (account, known device)**: an attempt carrying a valid known-device cookie for the account
 *   (known-device.ts, set at each successful sign-in) is counted in that device's own pair instead of
 *   the address's, with the same free attempts and delays, and the address and "under attack" limits
 *   do not apply to it: the owner's phone is never held up by a stranger's failures.
 * The account (the typed e-mail) is counted whether or not it exists, so the limits reveal nothing;
 * it is keyed by an HMAC of the e-mail (`accountKey`), so `rate_limits` holds no address.
 */
export async function beginSignInAttempt(email: string, address: string | null, deviceId: string | null = null): Promise<{ succeeded(): Promise<void> }> {
  const l = getLimiters();
  const pair = signInPairKey(email, address, deviceId);
  const account = accountKey(email);
  const refunds: (() => Promise<unknown>)[] = [];
  const refuse = async (ms: number): Promise<never> => {
    await Promise.all(refunds.map((r) => r()));
    throw new AttemptThrottledError(ms);
  };

  if (address && !deviceId) {
    const byAddress = await count(l.addressFailures, address);
    if (byAddress.consumedPoints > l.addressFailures.points) await refuse(byAddress.msBeforeNext);
    refunds.push(() => l.addressFailures.reward(address));
  }
  const byAccount = await count(l.accountFailures, account);
  refunds.push(() => l.accountFailures.reward(account));
  const byPair = await count(l.pairFree, pair);
  const underAttack = address !== null && !deviceId && byAccount.consumedPoints > l.accountFailures.points;
  if (underAttack && byPair.consumedPoints > 1) await refuse(byAccount.msBeforeNext);
  if (byPair.consumedPoints > l.pairFree.points) {
    const step = (await l.pairSteps.get(pair))?.consumedPoints ?? 0;
    const gate = await l.pairGate.penalty(pair, 1, { customDuration: pairDelaySeconds(step) });
    if (gate.consumedPoints > 1) await refuse(gate.msBeforeNext);
    await l.pairSteps.penalty(pair);
  }
  return {
    async succeeded() {
      await Promise.all([l.pairFree.delete(pair), l.pairGate.delete(pair), l.pairSteps.delete(pair), ...refunds.map((r) => r())]);
    },
  };
}

/** The limiters' key of an attempt's pair: the account's key and the known device, or the address ("local" when unseen). */
export function signInPairKey(email: string, address: string | null, deviceId: string | null = null): string {
  return `${accountKey(email)}|${deviceId ? `device:${deviceId}` : (address ?? "local")}`;
}

/** The gate after the free attempts: 1 minute, doubling with each gated attempt, at most 30 minutes. */
export function pairDelaySeconds(step: number): number {
  return Math.min(30 * 60, 60 * 2 ** step);
}

/** Refused by a limit; `retryAfterMs` is when the limit that refused lifts. */
export class AttemptThrottledError extends Error {
  constructor(readonly retryAfterMs: number) {
    super("throttled");
    this.name = "AttemptThrottledError";
  }
}

/** Counts one attempt; consume() rejects with the limiter's result when over its points, here an answer. */
export async function count(limiter: RateLimiterPostgres, key: string): Promise<RateLimiterRes> {
  try {
    return await limiter.consume(key);
  } catch (error) {
    if (error instanceof RateLimiterRes) return error;
    throw error;
  }
}
