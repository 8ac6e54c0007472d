import { authorizeCredentials } from "@/lib/auth/authorize";

export type Outcome = "signed in" | "wrong" | "throttled";

/** A browser's cookies as far as sign-in cares: what the last successful sign-in set. */
export type CookieJar = { cookies: Record<string, string> };
export const newJar = (): CookieJar => ({ cookies: {} });

/**
 * One sign-in attempt through authorizeCredentials, what the credentials provider's authorize
 * (lib/auth/options.ts, behind POST /api/auth/callback/credentials) calls, with the headers a
 * request would carry: `forwardedFor` becomes X-Forwarded-For, and a `jar` sends its cookies and
 * keeps the ones a success sets (the known-device cookie). Signed in, refused as wrong, or throttled.
 */
export async function attempt(email: string, password: string, forwardedFor?: string, jar?: CookieJar): Promise<Outcome> {
  const headers: Record<string, string> = forwardedFor ? { "x-forwarded-for": forwardedFor } : {};
  const cookie = Object.entries(jar?.cookies ?? {}).map(([name, value]) => `${name}=${value}`).join("; ");
  if (cookie) headers.cookie = cookie;
  const remember = async (set: { name: string; value: string }) => {
    if (jar) jar.cookies[set.name] = set.value;
  };
  try {
    return (await authorizeCredentials({ email, password }, headers, remember)) ? "signed in" : "wrong";
  } catch (error) {
    if (error instanceof Error && error.message.startsWith("throttled")) return "throttled";
    throw error;
  }
}
