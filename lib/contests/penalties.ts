import type { PenaltyCause } from "@/lib/events/schema";
import { PENALTY_CAUSE_WORDS } from "@/lib/field/ruling-words";
import { formatClock } from "@/lib/format";
import { applyPenaltyRules } from "@/lib/tasks/penalty-rules";

/** An officer's penalty as it counts (a removed one is left out before it gets here). */
export type OfficerPenalty = { id: string; points: number; cause: PenaltyCause };

/** A round's penalties for one pilot, from the three places they are recorded. */
export type RoundPenaltyInput = {
  /** The paper card's one number (group_slots.penalty_points), when the card is the record. */
  cardPoints: number;
  /** Officers' penalties one by one (contest_penalties, not removed). */
  officer: readonly OfficerPenalty[];
  /** The phone's penalties that count (run_lanes.derived by lib/results runResult: F3K.4.3's highest per attempt, F3K.4.1's zero already in the run's result). */
  phonePoints: number;
};

/** The round's penalty points, and whether a penalty zeroes the round (F3K.4.1 contact with a person at launch). */
export type RoundPenalty = { points: number; phonePoints: number; zeroesRound: boolean };

/**
 * The one place a pilot's penalties of a round are summed (lib/contests/standings.ts uses it):
 * card + officers' + phone's. Officers' penalties go through the same rules as the phone's
 * (lib/tasks/penalty-rules.ts `applyPenaltyRules`); an officer's penalty is not tied to an attempt,
 * so each counts in full (our reading, as for the phone's penalties without an attempt): F3K.4.3's
 * "several in one attempt → only the highest" is the officer's to apply when giving them (the round
 * page says so). An officer's "launch-contact" zeroes the round plus its points (F3K.4.1, RULES.md
 * "Penalties": "round scores 0 (plus the penalty)"). Penalties stay even when the round is dropped
 * (F3K.10), which lib/scoring applies to the total.
 */
export function roundPenalty(p: RoundPenaltyInput): RoundPenalty {
  const officer = applyPenaltyRules(p.officer.map((o) => ({ id: o.id, points: o.points, cause: o.cause, reason: "" })));
  return { points: p.cardPoints + officer.points + p.phonePoints, phonePoints: p.phonePoints, zeroesRound: officer.zeroesRound };
}

/** The points a cause carries by the rules (RULES.md "Penalties"), or null when the officer says (launch contact, other). */
export const fixedPenaltyPoints = (cause: PenaltyCause): number | null => PENALTY_CAUSE_WORDS[cause].points;

/** One penalty as listed (db/queries/contest-penalties.ts listContestPenalties): the round page, the results page, the penalties CSV, the PDF. */
export type ContestPenalty = {
  /** The officer's penalty's id (contest_penalties); null for the phone's and the card's. */
  id: string | null;
  roundNumber: number; isFlyOff: boolean; entryId: string; name: string;
  /** "officer": given on the round page (contest_penalties); "phone": a `penalty` event of the linked run's lane (or the re-flight's run), as runResult derived it; "card": the paper card's points. */
  source: "officer" | "phone" | "reflight-phone" | "card";
  points: number; cause: PenaltyCause | null; reason: string | null;
  /** Whether it counts (F3K.4.3: only the highest of one attempt, none for a mid-air collision; an officer's until removed); a card's always does. */
  applied: boolean; dropped: "mid-air-collision" | "higher-in-same-attempt" | null;
  /** Who gave it (the officer, the phone's account) or entered the card, and when (the officer's time, the event's corrected time, the card's recorded time). */
  givenBy: string | null; givenAtMs: number | null;
  /** An officer's penalty removed by an officer, or a phone's set aside by one: who, when, why (it no longer counts). */
  removedBy: string | null; removedAtMs: number | null; removedReason: string | null;
  /** A phone's penalty's `penalty` event (what an officer sets aside); null for the officers' and the card's. */
  eventId: string | null;
};

/** Whether a listed penalty came from a timekeeper's phone (an event in a run: set aside, not removed). */
export const fromPhone = (p: Pick<ContestPenalty, "source">) => p.source === "phone" || p.source === "reflight-phone";

const SOURCE_WORDS: Record<ContestPenalty["source"], string> = {
  officer: "given on the round page",
  phone: "given on the timekeeper's phone",
  "reflight-phone": "given on the phone in the re-flight",
  card: "on the paper card, entered",
};

/** Who gave a penalty and how, in words: "given by an officer" etc. */
export const penaltySourceWords = (source: ContestPenalty["source"]) => SOURCE_WORDS[source];

/** Why a listed penalty does not count, or null when it does. */
export function penaltyNotCounted(p: ContestPenalty): string | null {
  if (p.removedAtMs !== null) return fromPhone(p) ? "set aside" : "removed";
  if (p.applied) return null;
  return p.dropped === "mid-air-collision" ? "mid-air collision (F3K.4.3)" : "a higher penalty in the same attempt (F3K.4.3)";
}

/** The cause in words with its rule, e.g. "Model touched a person in a safety area (F3K.4.3)"; "" when none was given. */
export function penaltyCauseText(cause: PenaltyCause | null): string {
  if (!cause) return "";
  const w = PENALTY_CAUSE_WORDS[cause];
  return w.rule ? `${w.label} (${w.rule})` : w.label;
}

/** A time on the club's clock ("" when unknown). */
export const clockText = (ms: number | null, zone: string) => (ms === null ? "" : formatClock(new Date(ms), zone, "short"));

/** Who and when, e.g. "given by an officer by Ines Vale 14:02 CET" and, when removed, "; removed by … 14:10 CET: why" ("set aside by" for a phone's). */
export function penaltyWhoWhen(p: ContestPenalty, zone: string): string {
  const given = `${penaltySourceWords(p.source)} by ${p.givenBy ?? "someone"}${p.givenAtMs !== null ? ` ${clockText(p.givenAtMs, zone)}` : ""}`;
  const removed = fromPhone(p) ? "set aside by" : "removed by";
  return p.removedAtMs === null ? given : `${given}; ${removed} ${p.removedBy ?? "someone"} ${clockText(p.removedAtMs, zone)}${p.removedReason ? `: ${p.removedReason}` : ""}`;
}
