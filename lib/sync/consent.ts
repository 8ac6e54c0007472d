/**
 * Runs recorded for someone else (README "Runs recorded for you"). A lane whose pilot is not
 * the run's creator lands in that pilot's logbook as "recorded by <name>" and counts in their
 * record (results, home's recent sessions, later the season) only once they accept it. They
 * may instead dispute it (with a reason the recorder sees) or hide it (it leaves their lists,
 * not the server nor the recorder's logbook). A lane the pilot recorded themselves counts by
 * nature. The server stores only decisions: no decision yet means pending.
 */

/** What the pilot decided about a lane recorded for them. */
export type ConsentDecision = "accepted" | "disputed" | "hidden";

/** A lane's standing in its pilot's record: "own" when the pilot created the run, else their decision or "pending". */
export type ConsentStatus = "own" | "pending" | ConsentDecision;

/** What a pilot may send: a decision, or "pending" to take theirs back (un-hide a hidden run). */
export type ConsentChoice = ConsentDecision | "pending";

/** Decisions a pilot may take, in the order the screens offer them. */
export const CONSENT_DECISIONS: readonly ConsentDecision[] = ["accepted", "disputed", "hidden"];

/** Longest dispute reason (a sentence for the recorder). */
export const CONSENT_REASON_MAX = 280;

/** The lane's standing given who created the run, who flew it and the stored decision (if any). */
export function consentStatus(createdBy: string, pilotUserId: string | null, decision: ConsentDecision | null): ConsentStatus | null {
  if (pilotUserId === null) return null; // a guest's lane belongs to no account's record
  if (pilotUserId === createdBy) return "own";
  return decision ?? "pending";
}

/** Whether the lane counts in its pilot's record: their own, or accepted. */
export function countsForPilot(status: ConsentStatus | null): boolean {
  return status === "own" || status === "accepted";
}

/** Whether the pilot's lists show the lane at all (hidden ones stay on the server and with the recorder). */
export function listedForPilot(status: ConsentStatus | null): boolean {
  return status !== "hidden";
}
