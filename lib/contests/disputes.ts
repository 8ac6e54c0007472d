/**
 * Disputes (protests) about a pilot's result in a round, recorded by an officer (issue 15). A
 * dispute never changes a result itself: when it is upheld, the officer carries it out with an
 * action that already exists, and the dispute names which one (`DisputeAction`).
 */
export const DISPUTE_STATUSES = ["open", "upheld", "rejected"] as const;
export type DisputeStatus = (typeof DISPUTE_STATUSES)[number];

/**
 * How an upheld dispute was carried out, each an existing officer action: a re-flight granted in the
 * round (F3K.9.6), a decision between two records of the slot, the paper card corrected, a penalty
 * changed. "none": upheld without a change of result (a note on the record).
 */
export const DISPUTE_ACTIONS = ["reflight", "record-decision", "paper-card", "penalty", "none"] as const;
export type DisputeAction = (typeof DISPUTE_ACTIONS)[number];

export const DISPUTE_ACTION_WORDS: Record<DisputeAction, string> = {
  reflight: "a re-flight granted",
  "record-decision": "a decision between the two records",
  "paper-card": "the paper card corrected",
  penalty: "the penalty changed",
  none: "no change of result",
};

/** Where on the round's pages the action that carries out an upheld dispute is (a link from the dispute). */
export function disputeActionHref(contestId: string, roundKey: string, action: DisputeAction): string | null {
  const round = `/contests/${contestId}/rounds/${roundKey}`;
  if (action === "reflight") return `${round}#reflights-title`;
  if (action === "record-decision") return `${round}#records-title`;
  if (action === "penalty") return `${round}#penalties-title`;
  if (action === "paper-card") return `${round}/cards`;
  return null;
}

/** What the public link and the standings say about a slot with an open dispute (no names, no subject). */
export const UNDER_DISPUTE = "result under dispute";

/** How far before the contest's day a dispute may have been lodged (our choice: protests about entries or the draw made the day before, with a day's margin for the clubs' zones). */
export const LODGED_DAYS_BEFORE = 2;
/** A minute's allowance for the officer's device clock running ahead of the server's. */
const CLOCK_ALLOWANCE_MS = 60_000;

/**
 * Why the time an officer says a dispute was lodged cannot be right, or null: not in the future (the
 * server's clock, a minute's allowance), not more than LODGED_DAYS_BEFORE days before the contest's
 * day (00:00 UTC of `startsOn`, a calendar date).
 */
export function lodgedAtProblem(lodgedAt: Date, now: Date, startsOn: string): string | null {
  if (lodgedAt.getTime() > now.getTime() + CLOCK_ALLOWANCE_MS) return "A dispute cannot be lodged in the future.";
  const earliest = Date.parse(`${startsOn}T00:00:00Z`) - LODGED_DAYS_BEFORE * 86_400_000;
  if (lodgedAt.getTime() < earliest) return `A dispute is lodged at most ${LODGED_DAYS_BEFORE} days before the contest's day.`;
  return null;
}
