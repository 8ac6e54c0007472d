import { hash, verify } from "@node-rs/argon2";
import bcrypt from "bcryptjs";
import { randomBytes } from "node:crypto";

// argon2id (the package's default algorithm, 2) at the OWASP minimum: 19 MiB, 2 passes, 1 lane.
const OPTIONS = { algorithm: 2, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;
const CURRENT_PREFIX = `$argon2id$v=19$m=${OPTIONS.memoryCost},t=${OPTIONS.timeCost},p=${OPTIONS.parallelism}$`;

/** argon2id hash of a password, in PHC form. */
export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

/**
 * Checks a password against an argon2id hash, or a bcrypt hash from before argon2id (upgraded by
 * the caller at sign-in, see `needsRehash`). A missing hash is checked against a dummy argon2id hash
 * with the same settings, so an unknown account costs the same work and gets the same answer.
 */
export async function verifyPassword(password: string, stored: string | null | undefined): Promise<boolean> {
  if (stored && /^\$2[aby]\$/.test(stored)) return bcrypt.compare(password, stored);
  const target = stored?.startsWith("$argon2") ? stored : await dummyHash();
  const ok = await verify(target, password).catch(() => false);
  return ok && target === stored;
}

/** True when a stored hash is not argon2id with today's settings (a bcrypt hash, or older settings). */
export function needsRehash(stored: string): boolean {
  return !stored.startsWith(CURRENT_PREFIX);
}

let dummy: Promise<string> | undefined;
function dummyHash(): Promise<string> {
  return (dummy ??= hash(randomBytes(32).toString("hex"), OPTIONS));
}
