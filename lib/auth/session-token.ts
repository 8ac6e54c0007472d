import "server-only";
import { getToken, type JWT } from "next-auth/jwt";
import { cookies } from "next/headers";

/**
 * The session cookie's token, decoded by next-auth's own getToken (the same secret, cookie name and
 * chunks, encryption and expiry check as getServerSession), or null when there is none or it does not
 * decode. Only the cookie counts: no Authorization header is passed, so a bearer token is not accepted
 * here either. Nothing is re-issued (lib/auth/session.ts requireUserFromToken says when that is enough).
 */
export async function readSessionToken(): Promise<JWT | null> {
  return getToken({ req: { cookies: await cookies(), headers: new Headers() } as unknown as Parameters<typeof getToken>[0]["req"] });
}
