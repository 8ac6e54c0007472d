import "server-only";
import type { NextAuthOptions } from "next-auth";
import { db } from "@/db";
import { getSessionAccount } from "@/db/queries/users";
import { isAccountId, SessionRevokedError, sessionVerdict } from "./account-state";

type Callbacks = NonNullable<NextAuthOptions["callbacks"]>;

/**
 * next-auth callbacks for fresh sessions. The cookie carries the account id and the session
 * generation it was issued under (`sv`); every session check (getServerSession, /api/auth/session)
 * reads the account again and refuses the token when the account is gone, disabled or on a newer
 * generation. Refusing = throwing in `jwt`: next-auth then clears the cookie and answers "signed
 * out", so the browser's useSession() learns it too. requireUser() checks again on its own
 * (lib/auth/session.ts), so route handlers never rely on this alone.
 */
export const sessionCallbacks: Callbacks = {
  /** A disabled (or deleted) account cannot sign in, even with the right password; same message as a wrong one. */
  async signIn({ user }) {
    if (!isAccountId(user?.id)) return false;
    const account = await getSessionAccount(db, user.id);
    return !!account && !account.disabledAt;
  },

  async jwt({ token, user }) {
    if (user) token.uid = user.id;
    if (!isAccountId(token.uid)) throw new SessionRevokedError("gone");
    const account = await getSessionAccount(db, token.uid);
    // At sign-in the token adopts the account's current generation (signIn above has checked it).
    if (user && account) token.sv = account.sessionVersion;
    const verdict = sessionVerdict(account, token.sv);
    if (verdict !== "current" || !account) throw new SessionRevokedError(verdict === "current" ? "gone" : verdict);
    token.role = account.role;
    token.name = account.name;
    token.email = account.email;
    return token;
  },

  async session({ session, token }) {
    session.user = {
      id: token.uid as string,
      name: token.name ?? null,
      email: token.email ?? null,
      role: token.role ?? "member",
      sessionVersion: token.sv ?? 0,
    };
    return session;
  },
};

/** next-auth's logger, quiet about refused tokens (expected after a sign-out everywhere), loud about the rest. */
export const sessionLogger: NonNullable<NextAuthOptions["logger"]> = {
  error(code, metadata) {
    if (code === "JWT_SESSION_ERROR" && metadata instanceof SessionRevokedError) return;
    console.error(`[next-auth][error][${code}]`, metadata);
  },
};
