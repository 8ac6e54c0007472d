import { authOptions } from "@/lib/auth/options";

type Authorize = (credentials: Record<string, string>, req: { headers: Record<string, string>; method: string; body: object; query: object }) => Promise<unknown>;

// next-auth keeps our authorize under options; it is what POST /api/auth/callback/credentials calls.
const authorize = (authOptions.providers[0] as unknown as { options: { authorize: Authorize } }).options.authorize;

export type Outcome = "signed in" | "wrong" | "throttled";

/**
 * One sign-in attempt through the credentials provider's authorize, with the headers a request
 * would carry (`forwardedFor` becomes X-Forwarded-For): signed in, refused as wrong, or throttled.
 */
export async function attempt(email: string, password: string, forwardedFor?: string): Promise<Outcome> {
  const headers: Record<string, string> = forwardedFor ? { "x-forwarded-for": forwardedFor } : {};
  try {
    return (await authorize({ email, password }, { headers, method: "POST", body: {}, query: {} })) ? "signed in" : "wrong";
  } catch (error) {
    if (error instanceof Error && error.message.startsWith("throttled")) return "throttled";
    throw error;
  }
}
