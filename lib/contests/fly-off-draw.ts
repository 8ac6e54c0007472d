/**
 * Who flies the fly-off: the top pilots of the preliminary order, read from the one standings
 * value (`contestStandings(...).pilots`, so the order is never computed twice). F3K.10 says a
 * fly-off has 3–6 rounds and that preliminary points do not carry; RULES.md does not say how many
 * qualify (the officer sets it) nor what happens at a tie on the cut-off.
 *
 * Our choice at the cut-off (common practice; RULES.md is silent): every pilot who shares the place
 * of the last qualifier flies too, so the fly-off may hold more than the planned number. The tie is
 * one the standings could not break (same total and same dropped score, F3K.10 / F3K.10.2); leaving
 * one of them out would decide it by name, and a fly-off group of one or two more is easy to run.
 *
 * The fly-off is one group per fly-off round (every qualifier in each), so the draw has no choice in it.
 */
import type { Standings, StandingsInput } from "./standings";

/** Fewest pilots in a fly-off: a round normalised on its best needs rivals. */
export const MIN_FLY_OFF_PILOTS = 2;
/** Most pilots the officer may plan for a fly-off (one group). */
export const MAX_FLY_OFF_PILOTS = 30;

export type FlyOffDraw =
  | { ok: true; entryIds: string[]; names: string[]; tiedAtCutOff: string[]; cutOffRank: number }
  | { ok: false; problem: string };

/**
 * The fly-off's pilots: the first `qualifiers` of the preliminary order (withdrawn entries left
 * out), plus any pilot tied with the last of them. Refused while a preliminary round has no draw
 * or a drawn, live pilot has no result in it (every preliminary round must be scored).
 */
export function drawFlyOff(input: StandingsInput, standings: Standings, qualifiers: number): FlyOffDraw {
  const prelim = input.rounds.filter((r) => !r.isFlyOff).sort((a, b) => a.number - b.number);
  if (prelim.length === 0) return { ok: false, problem: "The contest has no preliminary rounds." };
  const withdrawn = new Set(input.entries.filter((e) => e.withdrawn).map((e) => e.id));
  const missing: string[] = [];
  for (const round of prelim) {
    const slots = input.slots.filter((s) => s.roundId === round.id && !withdrawn.has(s.entryId));
    if (slots.length === 0) { missing.push(`round ${round.number} has no draw`); continue; }
    const open = slots.filter((s) => s.paperFlights === null && s.runResultTenths === null).length;
    if (open > 0) missing.push(`round ${round.number} has ${open} pilot${open === 1 ? "" : "s"} without a result`);
  }
  if (missing.length > 0) return { ok: false, problem: `Score every preliminary round before the fly-off is drawn: ${missing.join("; ")}.` };

  const live = standings.pilots.filter((p) => !withdrawn.has(p.entryId));
  if (live.length < MIN_FLY_OFF_PILOTS) return { ok: false, problem: `A fly-off needs at least ${MIN_FLY_OFF_PILOTS} pilots; ${live.length} can fly.` };
  const n = Math.min(qualifiers, live.length);
  const cutOffRank = live[n - 1]!.rank;
  const chosen = live.filter((p, i) => i < n || p.rank === cutOffRank);
  // Pilots past the planned number came in on a tie: name everyone sharing that place.
  const tiedAtCutOff = chosen.length > n ? chosen.filter((p) => p.rank === cutOffRank).map((p) => p.name) : [];
  return { ok: true, entryIds: chosen.map((p) => p.entryId), names: chosen.map((p) => p.name), tiedAtCutOff, cutOffRank };
}
