import "server-only";
import { createHmac, randomBytes, timingSafeEqual } from "node:crypto";

/**
 * Keyed names for the attempt limits (README: "What is protected and how").
 *
 * - `accountKey(email)`: the limiters' name for an account, an HMAC (NEXTAUTH_SECRET) of the
 *   lower-cased e-mail, so `rate_limits` holds no e-mail address.
 * - The **known-device cookie**: set at every successful sign-in, httpOnly and SameSite=Lax, it
 *   names the account (by its key) and a random device id, signed with the same secret. An attempt
 *   that carries a valid one for the account it names is counted in its own (account, device)
 *   bucket (attempts.ts), so a stranger's failures from a shared or unseen address never hold up
 *   the owner on a phone that signed in before.
 */

/** A year: the phone of a pilot who signs in once a season stays known. */
export const KNOWN_DEVICE_MAX_AGE = 365 * 24 * 60 * 60;

function secret(): string {
  const value = process.env.NEXTAUTH_SECRET;
  if (!value) throw new Error("NEXTAUTH_SECRET is not set (npm start writes it to .env)");
  return value;
}

function mac(...parts: string[]): string {
  return createHmac("sha256", secret()).update(parts.join("\n")).digest("base64url");
}

/** The limiters' key for an account: 32 characters of an HMAC of the trimmed, lower-cased e-mail. */
export function accountKey(email: string): string {
  return mac("account", email.trim().toLowerCase()).slice(0, 32);
}

/** One cookie per account, so a shared phone remembers each pilot who signed in on it. */
export function knownDeviceCookieName(email: string): string {
  return `wc-known-${accountKey(email).slice(0, 12)}`;
}

export type DeviceCookie = {
  name: string;
  value: string;
  options: { httpOnly: true; sameSite: "lax"; path: "/"; maxAge: number; secure: boolean };
};

/** The cookie to set after a successful sign-in; `deviceId` keeps the device's id when it had one. */
export function issueKnownDevice(email: string, deviceId: string = randomBytes(16).toString("base64url")): DeviceCookie {
  return {
    name: knownDeviceCookieName(email),
    value: `${deviceId}.${mac("known-device", accountKey(email), deviceId)}`,
    // next-auth marks its own cookies Secure when NEXTAUTH_URL is https; so do we
    options: { httpOnly: true, sameSite: "lax", path: "/", maxAge: KNOWN_DEVICE_MAX_AGE, secure: (process.env.NEXTAUTH_URL ?? "").startsWith("https://") },
  };
}

/** The device id of a valid known-device cookie for this account among the request's headers, else null. */
export function knownDeviceId(email: string, headers: Record<string, unknown> | undefined): string | null {
  const raw = headers?.["cookie"];
  const header = Array.isArray(raw) ? raw.join("; ") : raw;
  if (typeof header !== "string") return null;
  const name = knownDeviceCookieName(email);
  const value = header
    .split(";")
    .map((part) => part.trim())
    .find((part) => part.startsWith(`${name}=`))
    ?.slice(name.length + 1);
  const [deviceId, signature, ...rest] = (value ?? "").split(".");
  if (!deviceId || !signature || rest.length || deviceId.length > 64) return null;
  const expected = Buffer.from(mac("known-device", accountKey(email), deviceId));
  const given = Buffer.from(signature);
  return given.length === expected.length && timingSafeEqual(given, expected) ? deviceId : null;
}
