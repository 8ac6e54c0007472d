import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { db } from "@/db";
import { getUserByEmail, upgradePasswordHash } from "@/db/queries/users";
import { signInSchema } from "@/lib/validations/auth";
import { AttemptThrottledError, beginSignInAttempt } from "./attempts";
import { clientAddress } from "./client-address";
import { hashPassword, needsRehash, verifyPassword } from "./password";

/** next-auth: e-mail + password (argon2id), JWT session in a cookie, attempts limited by attempts.ts. */
export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 30 * 24 * 60 * 60 },
  pages: { signIn: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "E-mail",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        // counted before the password is checked (attempts.ts); "throttled:<minutes>" for the form
        const attempt = await beginSignInAttempt(email, clientAddress(req?.headers)).catch((error: unknown) => {
          if (error instanceof AttemptThrottledError) throw new Error(`throttled:${Math.max(1, Math.ceil(error.retryAfterMs / 60_000))}`);
          throw error;
        });
        const user = await getUserByEmail(db, email);
        const ok = await verifyPassword(password, user?.passwordHash); // a dummy hash when there is no account
        if (!ok || !user?.passwordHash) return null;
        await attempt.succeeded();
        if (needsRehash(user.passwordHash)) await upgradePasswordHash(db, user.id, user.passwordHash, await hashPassword(password));
        return { id: user.id, email: user.email, name: user.name, role: user.role };
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.role = (user as { role?: "member" | "admin" }).role ?? "member";
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user) {
        session.user.id = token.uid as string;
        session.user.role = (token.role as "member" | "admin") ?? "member";
      }
      return session;
    },
  },
};
