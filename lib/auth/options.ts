import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { cookies } from "next/headers";
import { authorizeCredentials } from "./authorize";
import { sessionCallbacks, sessionLogger } from "./session-callbacks";

/** next-auth: e-mail + password (argon2id), JWT session in a cookie, checked by authorize.ts. */
export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 30 * 24 * 60 * 60 },
  pages: { signIn: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "E-mail",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      // a success sets the known-device cookie on next-auth's response (Next merges cookies set in a route handler)
      authorize: (credentials, req) =>
        authorizeCredentials(credentials, req?.headers, async ({ name, value, options }) => {
          (await cookies()).set(name, value, options);
        }),
    }),
  ],
  // The account is re-read on every session check (session-callbacks.ts): no stale role or account.
  callbacks: sessionCallbacks,
  logger: sessionLogger,
};
