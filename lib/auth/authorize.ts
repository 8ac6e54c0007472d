import "server-only";
import { db } from "@/db";
import { getUserByEmail, upgradePasswordHash } from "@/db/queries/users";
import { signInSchema } from "@/lib/validations/auth";
import { AttemptThrottledError, beginSignInAttempt } from "./attempts";
import { clientAddress } from "./client-address";
import { issueKnownDevice, knownDeviceId, type DeviceCookie } from "./known-device";
import { hashPassword, needsRehash, verifyPassword } from "./password";

export type AuthorizedUser = { id: string; email: string; name: string; role: "member" | "admin" };

/**
 * The credentials check behind POST /api/auth/callback/credentials (options.ts): the attempt is
 * counted first (attempts.ts), then the password is checked against the account's hash or a dummy
 * one, so an unknown address costs the same and gets the same null. A bcrypt hash is upgraded to
 * argon2id on success. Throttled attempts throw "throttled:<minutes>", which the form shows.
 * A request carrying this account's known-device cookie (known-device.ts) is counted in that device's
 * own bucket; each success hands `remember` the cookie to set (the device's id kept, or a new one).
 */
export async function authorizeCredentials(
  credentials: unknown,
  headers: Record<string, unknown> | undefined,
  remember?: (cookie: DeviceCookie) => Promise<void>,
): Promise<AuthorizedUser | null> {
  const parsed = signInSchema.safeParse(credentials);
  if (!parsed.success) return null;
  const { email, password } = parsed.data;
  const deviceId = knownDeviceId(email, headers);
  const attempt = await beginSignInAttempt(email, clientAddress(headers), deviceId).catch((error: unknown) => {
    if (error instanceof AttemptThrottledError) throw new Error(`throttled:${Math.max(1, Math.ceil(error.retryAfterMs / 60_000))}`);
    throw error;
  });
  const user = await getUserByEmail(db, email);
  const ok = await verifyPassword(password, user?.passwordHash);
  if (!ok || !user?.passwordHash) return null;
  await attempt.succeeded();
  await remember?.(issueKnownDevice(email, deviceId ?? undefined));
  if (needsRehash(user.passwordHash)) await upgradePasswordHash(db, user.id, user.passwordHash, await hashPassword(password));
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}
