import { createHash, randomInt } from "node:crypto";

/** Letters and digits a coach cannot misread from a pilot's screen (no 0/O, 1/I/L). */
const ALPHABET = "ABCDEFGHJKMNPQRSTUVWXYZ23456789";
export const CODE_LENGTH = 8;
/** How long a one-time code stays good. */
export const CODE_TTL_MS = 24 * 3600 * 1000;
/** How long an offer by e-mail waits for the coach to open the Coach desk. */
export const EMAIL_OFFER_TTL_MS = 30 * 24 * 3600 * 1000;

/** A fresh one-time code, e.g. "K7QM-2XPA" (the hyphen is for reading only). */
export function newCoachCode(): string {
  let code = "";
  for (let i = 0; i < CODE_LENGTH; i++) code += ALPHABET[randomInt(ALPHABET.length)];
  return `${code.slice(0, 4)}-${code.slice(4)}`;
}

/** The code as stored: upper-cased, hyphens and spaces dropped, then SHA-256 in hex. */
export function hashCoachCode(code: string): string {
  return createHash("sha256").update(normaliseCoachCode(code)).digest("hex");
}

export function normaliseCoachCode(code: string): string {
  return code.toUpperCase().replace(/[\s-]/g, "");
}
