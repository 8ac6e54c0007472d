import { z } from "zod";

/**
 * Bounds every schema shares, so what a route accepts always fits its column: a value the
 * database cannot hold is a 422 with a message, never a 500 from PostgreSQL (issue #9).
 */

/** PostgreSQL `integer` (int4). */
export const INT4_MAX = 2_147_483_647;

/**
 * Milliseconds since the Unix epoch that a JS `Date` and a PostgreSQL `timestamptz` both hold
 * in the ISO form the driver sends (years 0000–9999: a Date past 9999 prints as "+010000-…",
 * which PostgreSQL cannot parse). Device clocks can be wildly wrong (a phone reset to 1970), so
 * anything from the epoch to the end of year 9999 is accepted.
 */
export const EPOCH_MS_MAX = 253_402_300_799_999; // 9999-12-31T23:59:59.999Z

/** A device's clock offset from the server: a phone reset to 1970 is still inside (≈ 56 years). */
export const MAX_OFFSET_MS = 100 * 365.25 * 86_400_000;

/** Round trip of a usable clock exchange: beyond this the estimate says nothing useful. */
export const MAX_DELAY_MS = 10 * 60_000;

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Why a string is refused: PostgreSQL text and jsonb cannot hold NUL or lone surrogates. */
export function textProblem(s: string): string | null {
  if (s.includes("\u0000")) return "must not contain NUL characters";
  if (LONE_SURROGATE.test(s)) return "must be valid Unicode text";
  return null;
}

/** A string of at most `max` characters that PostgreSQL text can store. */
export function text(max: number) {
  return z
    .string()
    .max(max, `must be at most ${max} characters`)
    .superRefine((s, ctx) => {
      const problem = textProblem(s);
      if (problem) ctx.addIssue({ code: "custom", message: problem });
    });
}

/** An integer PostgreSQL `integer` holds, within [min, INT4_MAX]. */
export function int4(min = 0) {
  return z.number().int().min(min).max(INT4_MAX);
}

/** Milliseconds since the epoch that fit a `Date` and a `timestamptz` (and, so, a double column). */
export const epochMs = z.number().finite().min(0, "must not be before 1970").max(EPOCH_MS_MAX, "is beyond the last representable date");

/** A bounded, finite millisecond duration or monotonic reading. */
export const durationMs = z.number().finite().min(0).max(EPOCH_MS_MAX);

/** Limits for opaque JSON (a run's task): size when serialised, nesting depth, every string and key. */
export type JsonLimits = { maxBytes: number; maxDepth: number };

/** Why a JSON value breaks the limits (null when it fits). */
export function jsonProblem(value: unknown, limits: JsonLimits): string | null {
  const walk = (v: unknown, depth: number): string | null => {
    if (depth > limits.maxDepth) return `is nested deeper than ${limits.maxDepth} levels`;
    if (typeof v === "string") return textProblem(v);
    if (typeof v === "number") return Number.isFinite(v) ? null : "holds a number that is not finite";
    if (v === null || typeof v === "boolean") return null;
    if (Array.isArray(v)) {
      for (const x of v) {
        const p = walk(x, depth + 1);
        if (p) return p;
      }
      return null;
    }
    if (typeof v === "object") {
      for (const [k, x] of Object.entries(v)) {
        const p = textProblem(k) ?? walk(x, depth + 1);
        if (p) return p;
      }
      return null;
    }
    return "holds a value that is not JSON";
  };
  const problem = walk(value, 0);
  if (problem) return problem;
  const size = new TextEncoder().encode(JSON.stringify(value)).length;
  return size > limits.maxBytes ? `is larger than ${limits.maxBytes} bytes` : null;
}
