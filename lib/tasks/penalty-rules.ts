import type { PenaltyCause } from "@/lib/events/schema";

/** A penalty as recorded on a lane (undo already applied). */
export type RecordedPenalty = {
  id: string;
  points: number;
  reason: string;
  /** Absent on penalties recorded before causes existed. */
  cause?: PenaltyCause;
  /** The launch event of the attempt it happened in; absent = not tied to an attempt. */
  launchId?: string;
  /** The contact came from a mid-air collision. */
  midAir?: boolean;
};

export type PenaltyVerdict = RecordedPenalty & {
  applied: boolean;
  /** Why a penalty does not count, or null when it does. */
  dropped: "mid-air-collision" | "higher-in-same-attempt" | null;
};

export type PenaltyOutcome = {
  /** Points taken from the round score. */
  points: number;
  /** Every recorded penalty with its verdict, in the order given. */
  verdicts: PenaltyVerdict[];
  /** A contact at launch zeroes the round (plus the penalty), F3K.4.1. */
  zeroesRound: boolean;
};

/**
 * The penalty rules of RULES.md "Penalties":
 * - F3K.4.3: several penalties in one attempt → only the highest counts (equal highest: the
 *   first recorded counts, the others are dropped);
 * - F3K.4.3: none when the contact came from a mid-air collision;
 * - F3K.4.1: a contact with a person at launch zeroes the round, plus the penalty.
 * Our reading: penalties not tied to an attempt (no `launchId`) are each their own attempt, so
 * they all count, as they did before attempts were recorded. A mid-air contact at launch
 * neither costs points nor zeroes the round (the collision is not the pilot's doing); a contact
 * at launch zeroes the round even when a higher penalty of the same attempt takes its points.
 */
export function applyPenaltyRules(penalties: readonly RecordedPenalty[]): PenaltyOutcome {
  const verdicts: PenaltyVerdict[] = penalties.map((p) => ({ ...p, applied: !p.midAir, dropped: p.midAir ? "mid-air-collision" : null }));
  const highest = new Map<string, PenaltyVerdict>();
  for (const v of verdicts) {
    if (!v.applied || v.launchId === undefined) continue;
    const best = highest.get(v.launchId);
    if (!best) {
      highest.set(v.launchId, v);
      continue;
    }
    const loser = v.points > best.points ? best : v;
    loser.applied = false;
    loser.dropped = "higher-in-same-attempt";
    if (loser === best) highest.set(v.launchId, v);
  }
  const applied = verdicts.filter((v) => v.applied);
  return {
    points: applied.reduce((sum, v) => sum + v.points, 0),
    verdicts,
    zeroesRound: verdicts.some((v) => v.cause === "launch-contact" && v.dropped !== "mid-air-collision"),
  };
}
