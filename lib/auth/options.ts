import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { db } from "@/db";
import { clearSignInFailures, getUserByEmail, isThrottled, recordSignInFailure } from "@/db/queries/users";
import { signInSchema } from "@/lib/validations/auth";
import { verifyPassword } from "./password";

const PER_EMAIL_LIMIT = 5;
const PER_ADDRESS_LIMIT = 30;

function clientAddress(headers: Record<string, unknown> | undefined): string {
  const forwarded = headers?.["x-forwarded-for"];
  const first = typeof forwarded === "string" ? forwarded.split(",")[0]?.trim() : undefined;
  return first || "local";
}

/** next-auth: e-mail + password, JWT session in a cookie, throttled per e-mail and per address. */
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
        const emailKey = `email:${parsed.data.email}`;
        const addressKey = `addr:${clientAddress(req?.headers)}`;
        if ((await isThrottled(db, emailKey)) || (await isThrottled(db, addressKey))) {
          throw new Error("throttled");
        }
        const user = await getUserByEmail(db, parsed.data.email);
        if (!(await verifyPassword(parsed.data.password, user?.passwordHash))) {
          await recordSignInFailure(db, emailKey, PER_EMAIL_LIMIT);
          await recordSignInFailure(db, addressKey, PER_ADDRESS_LIMIT);
          return null;
        }
        await clearSignInFailures(db, emailKey);
        return { id: user!.id, email: user!.email, name: user!.name, role: user!.role };
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
