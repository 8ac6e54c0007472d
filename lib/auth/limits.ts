import "server-only";
import { getLimiters } from "@/db/limits";
import type { ErrorBody } from "@/lib/errors";
import { count } from "./attempts";
import { clientAddress } from "./client-address";

/**
 * Limits on routes other than sign-in, with the same limiters (db/limits.ts). Each counts first and
 * answers a ready 429 (with Retry-After) or null, so a route adds one line.
 */

/** Sign-ups per address: 30 an hour; 300 an hour for everyone together when no address is visible (client-address.ts). */
export async function signUpLimit(request: Request): Promise<Response | null> {
  const address = clientAddress(Object.fromEntries(request.headers));
  const limiter = address ? getLimiters().signUps : getLimiters().signUpsUnseen;
  const res = await count(limiter, address ?? "all");
  if (res.consumedPoints <= limiter.points) return null;
  return tooMany("Too many new accounts from this network. Try again later.", res.msBeforeNext);
}

/** Pushes per account (120 a minute: a phone pushes every few seconds at most). */
export async function pushLimit(userId: string): Promise<Response | null> {
  const limiter = getLimiters().pushes;
  const res = await count(limiter, userId);
  if (res.consumedPoints <= limiter.points) return null;
  return tooMany("Too many sends from this account. The phone will try again shortly.", res.msBeforeNext);
}

/**
 * Password-reset requests: per address (10 an hour; 100 for everyone together when no address is
 * visible) and per typed e-mail, counted whether or not it has an account (5 an hour), so the limit
 * tells nothing and nobody can flood an inbox with reset mail.
 */
export async function passwordResetLimit(request: Request, email: string): Promise<Response | null> {
  const l = getLimiters();
  const address = clientAddress(Object.fromEntries(request.headers));
  const byAddress = address ? l.resetRequests : l.resetRequestsUnseen;
  const a = await count(byAddress, address ?? "all");
  if (a.consumedPoints > byAddress.points) return tooMany("Too many password resets from this network. Try again later.", a.msBeforeNext);
  const b = await count(l.resetAccount, email);
  if (b.consumedPoints > l.resetAccount.points) return tooMany("Too many password resets for this e-mail. Try again later.", b.msBeforeNext);
  return null;
}

/** E-mails a signed-in user asks for (verification again, an e-mail change): 5 an hour per account. */
export async function accountMailLimit(userId: string): Promise<Response | null> {
  const limiter = getLimiters().accountMail;
  const res = await count(limiter, userId);
  if (res.consumedPoints <= limiter.points) return null;
  return tooMany("Too many e-mails asked for this account. Try again later.", res.msBeforeNext);
}

/** Club invitations: 50 an hour per inviting account, and 3 an hour to one address (nobody floods an inbox). */
export async function invitationLimit(userId: string, email: string): Promise<Response | null> {
  const l = getLimiters();
  const a = await count(l.invitations, userId);
  if (a.consumedPoints > l.invitations.points) return tooMany("Too many invitations from this account. Try again later.", a.msBeforeNext);
  const b = await count(l.invitationsTo, email);
  if (b.consumedPoints > l.invitationsTo.points) return tooMany("Too many invitations to this address. Try again later.", b.msBeforeNext);
  return null;
}

/** A pilot's offers of their season to a coach (e-mail or code): 20 an hour per account. */
export async function coachOfferLimit(userId: string): Promise<Response | null> {
  const limiter = getLimiters().coachOffers;
  const res = await count(limiter, userId);
  if (res.consumedPoints <= limiter.points) return null;
  return tooMany("Too many offers from this account. Try again later, or revoke an offer you no longer need.", res.msBeforeNext);
}

/**
 * One-time coach codes a signed-in user types in (POST /api/coach/claim): 10 an hour per account
 * and, when the address is visible, 60 an hour per address, so nobody guesses a pilot's code.
 */
export async function coachClaimLimit(request: Request, userId: string): Promise<Response | null> {
  const l = getLimiters();
  const a = await count(l.coachClaims, userId);
  if (a.consumedPoints > l.coachClaims.points) return tooMany("Too many codes tried from this account. Try again in an hour.", a.msBeforeNext);
  const address = clientAddress(Object.fromEntries(request.headers));
  if (address) {
    const b = await count(l.coachClaimsFrom, address);
    if (b.consumedPoints > l.coachClaimsFrom.points) return tooMany("Too many codes tried from this network. Try again later.", b.msBeforeNext);
  }
  return null;
}

function tooMany(message: string, retryAfterMs: number): Response {
  const body: ErrorBody = { error: { code: "rate_limited", message } };
  return Response.json(body, { status: 429, headers: { "retry-after": String(Math.max(1, Math.ceil(retryAfterMs / 1000))) } });
}
