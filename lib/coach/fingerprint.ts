import { createHash } from "node:crypto";

/**
 * The pull's `coaching` fingerprint (pullReplySchema.coaching): SHA-256 (hex) of the notes and plans
 * a user may read, in the order the pull lists them. Anything the phone shows changes it — a new
 * note or answer, a plan made, edited, closed, or flown further (its progress), a revoked grant
 * (the coach's notes of that pilot leave the set) — except a plan's `pilotSyncedAtMs`, which moves
 * on every push of the pilot and which only the Coach desk shows (it reads it fresh from its route,
 * not from the pull): counting it would resend the plans after every push.
 */
// Typed by shape (the pulled notes and plans of lib/validations/coaching-sync), so lib/coach need not import lib/validations, which imports it.
export function coachingFingerprint(notes: readonly object[], plans: readonly object[]): string {
  const stable = plans.map((p) => ({ ...p, pilotSyncedAtMs: null }));
  return createHash("sha256").update(JSON.stringify({ notes, plans: stable })).digest("hex");
}
