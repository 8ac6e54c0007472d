import bcrypt from "bcryptjs";

const COST = 10;

/** bcrypt hash of a password (bcryptjs, cost 10). */
export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

/** Constant-time comparison via bcrypt; a missing hash still costs one compare, so timing reveals nothing. */
export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return ok && !!hash;
}

// A hash of a random string, compared against when the account does not exist.
const DUMMY_HASH = "$2b$10$V5NKX7U.51d7Swk1JwXY.ethxKWxhO4vAZ66Nq4jTeYw/eSoNtWxu";
