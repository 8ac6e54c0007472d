import { contestTotal, type ContestTotal } from "./total";

export type PilotEntry = { pilotId: string; rounds: number[]; penalties: number };

export type Standing = ContestTotal & {
  pilotId: string;
  /** 1-based place; pilots still tied share it. */
  rank: number;
  /** Tied on total and dropped score: the rules call for a one-task fly-off (F3K.10). */
  unresolvedTie: boolean;
};

/**
 * Ranks pilots by total (F3K.10). Equal totals: the better dropped score ranks higher;
 * still equal (or no round dropped) → the same place, flagged as an unresolved tie.
 * `dropFrom` as in contestTotal (fly-offs pass their own choice).
 */
export function rankPilots(entries: readonly PilotEntry[], options: { dropFrom?: number } = {}): Standing[] {
  const rows = entries.map((e) => ({ pilotId: e.pilotId, ...contestTotal({ rounds: e.rounds, penalties: e.penalties, dropFrom: options.dropFrom }) }));
  const dropKey = (r: (typeof rows)[number]) => r.dropped?.tenths ?? Number.NEGATIVE_INFINITY;
  rows.sort((a, b) => b.totalTenths - a.totalTenths || dropKey(b) - dropKey(a) || (a.pilotId < b.pilotId ? -1 : a.pilotId > b.pilotId ? 1 : 0));
  const same = (a: (typeof rows)[number], b: (typeof rows)[number]) =>
    a.totalTenths === b.totalTenths && (a.dropped?.tenths ?? null) === (b.dropped?.tenths ?? null);
  const out: Standing[] = [];
  rows.forEach((row, i) => {
    const prev = out[i - 1];
    const tiedPrev = prev !== undefined && same(rows[i - 1]!, row);
    const tiedNext = i + 1 < rows.length && same(row, rows[i + 1]!);
    out.push({ ...row, rank: tiedPrev ? prev.rank : i + 1, unresolvedTie: tiedPrev || tiedNext });
  });
  return out;
}

/**
 * Fly-off standings, kept apart from the preliminary ones: only fly-off rounds and fly-off
 * penalties count (preliminary points and penalties do not carry over, F3K.10). Whether a
 * fly-off round is dropped is not stated; the default here is no drop (`dropFrom` to change).
 */
export function rankFlyOff(entries: readonly PilotEntry[], options: { dropFrom?: number } = {}): Standing[] {
  return rankPilots(entries, { dropFrom: options.dropFrom ?? Number.POSITIVE_INFINITY });
}

export type FinalPlace = { pilotId: string; rank: number; stage: "fly-off" | "preliminary" };

/**
 * The final order: fly-off pilots first, in fly-off order; everyone else after them in
 * preliminary order (places continue from the fly-off's).
 */
export function finalStandings(preliminary: readonly Standing[], flyOff: readonly Standing[]): FinalPlace[] {
  const inFlyOff = new Set(flyOff.map((s) => s.pilotId));
  const out: FinalPlace[] = flyOff.map((s) => ({ pilotId: s.pilotId, rank: s.rank, stage: "fly-off" }));
  const rest = preliminary.filter((s) => !inFlyOff.has(s.pilotId));
  let lastRank = 0;
  let lastPrelim = Number.NaN;
  rest.forEach((s, i) => {
    const rank = s.rank === lastPrelim ? lastRank : flyOff.length + i + 1;
    out.push({ pilotId: s.pilotId, rank, stage: "preliminary" });
    lastRank = rank;
    lastPrelim = s.rank;
  });
  return out;
}

export type TeamEntry = { teamId: string; memberIds: string[] };
export type TeamStanding = { teamId: string; rank: number; totalTenths: number; total: number; countedMemberIds: string[] };

/**
 * Team ranking (F3K.10.4): the sum of the final scores of each team's three best members.
 * A team with fewer than three ranked members sums those it has. Equal sums share a place.
 */
export function rankTeams(teams: readonly TeamEntry[], standings: readonly { pilotId: string; totalTenths: number }[], counted = 3): TeamStanding[] {
  const byPilot = new Map(standings.map((s) => [s.pilotId, s.totalTenths]));
  const rows = teams.map((t) => {
    const best = t.memberIds
      .filter((id) => byPilot.has(id))
      .sort((a, b) => byPilot.get(b)! - byPilot.get(a)! || (a < b ? -1 : 1))
      .slice(0, counted);
    const totalTenths = best.reduce((sum, id) => sum + byPilot.get(id)!, 0);
    return { teamId: t.teamId, totalTenths, total: totalTenths / 10, countedMemberIds: best };
  });
  rows.sort((a, b) => b.totalTenths - a.totalTenths || (a.teamId < b.teamId ? -1 : 1));
  const out: TeamStanding[] = [];
  rows.forEach((r, i) => {
    const prev = out[i - 1];
    out.push({ ...r, rank: prev && prev.totalTenths === r.totalTenths ? prev.rank : i + 1 });
  });
  return out;
}
