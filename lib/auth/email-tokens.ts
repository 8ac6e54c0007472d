import { createHash, randomBytes } from "node:crypto";

/**
 * One-time e-mail links carry 256 random bits; the database keeps only their SHA-256, so a copy of
 * it (a backup, say) opens no link. Lifetimes per purpose.
 */
export const TOKEN_TTL_MS = { verify: 48 * 3600_000, reset: 45 * 60_000, "change-email": 24 * 3600_000 } as const;

export function newEmailToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashEmailToken(token) };
}

export function hashEmailToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}
