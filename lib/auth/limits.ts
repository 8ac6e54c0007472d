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

function tooMany(message: string, retryAfterMs: number): Response {
  const body: ErrorBody = { error: { code: "rate_limited", message } };
  return Response.json(body, { status: 429, headers: { "retry-after": String(Math.max(1, Math.ceil(retryAfterMs / 1000))) } });
}
