// GET/POST /api/auth/* — next-auth's sign-in, sign-out, session and CSRF endpoints (odd requests get a 4xx, never a 500)
import NextAuth from "next-auth";
import { guardAuthHandler } from "@/lib/api-auth-guard";
import { authOptions } from "@/lib/auth/options";

const handler = guardAuthHandler(NextAuth(authOptions));
export { handler as GET, handler as POST };
