import "next-auth";
import "next-auth/jwt";

declare module "next-auth" {
  interface Session {
    user: { id: string; name?: string | null; email?: string | null; role: "member" | "admin"; sessionVersion: number };
  }
}

declare module "next-auth/jwt" {
  /** What our session cookie carries: the account id, its role when last read and its session generation. */
  interface JWT {
    uid?: string;
    role?: "member" | "admin";
    sv?: number;
  }
}
