import { makeDraw, type DrawResult } from "./draw";

export type DrawEntry = { id: string; keepApart: string | null };
export type RoundGroups = { roundNumber: number; groups: string[][] };

const byId = (a: DrawEntry, b: DrawEntry) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);

/** Index pairs of entries sharing a keep-apart word (compared without case). */
function apartPairs(sorted: readonly DrawEntry[]): [number, number][] {
  const apart: [number, number][] = [];
  sorted.forEach((a, i) => sorted.forEach((b, j) => {
    if (i < j && a.keepApart && a.keepApart.toLowerCase() === b.keepApart?.toLowerCase()) apart.push([i, j]);
  }));
  return apart;
}

/**
 * The draw for a contest's live entries: entries sorted by id (so the same entries and seed give
 * the same draw whatever order they were read in), entries sharing a keep-apart word kept apart.
 */
export function drawEntries(p: { entries: DrawEntry[]; rounds: number[]; maxGroupSize: number; seed: number }): {
  rounds: RoundGroups[];
  result: DrawResult;
} {
  return redrawRemaining({ ...p, flown: [], remaining: p.rounds });
}

/**
 * A re-draw of the rounds not flown yet (`remaining`), for today's live entries — a pilot who
 * withdrew is left out, a late entry joins — keeping the `flown` rounds as they were. Who already
 * met in a flown round counts as met, so the new rounds spread the meetings of the whole contest;
 * the stats returned are over flown and new rounds together (pilots no longer entered left out).
 */
export function redrawRemaining(p: { entries: DrawEntry[]; flown: RoundGroups[]; remaining: number[]; maxGroupSize: number; seed: number }): {
  rounds: RoundGroups[];
  result: DrawResult;
} {
  const sorted = [...p.entries].sort(byId);
  const index = new Map(sorted.map((e, i) => [e.id, i]));
  const met = sorted.map(() => new Array<number>(sorted.length).fill(0));
  for (const round of p.flown) {
    for (const group of round.groups) {
      const here = group.flatMap((id) => (index.has(id) ? [index.get(id)!] : []));
      for (const x of here) for (const y of here) if (x !== y) met[x]![y]! += 1;
    }
  }
  const result = makeDraw({ pilots: sorted.length, rounds: p.remaining.length, maxGroupSize: p.maxGroupSize, seed: p.seed, apart: apartPairs(sorted), met });
  return {
    rounds: result.rounds.map((groups, r) => ({ roundNumber: p.remaining[r]!, groups: groups.map((g) => g.map((i) => sorted[i]!.id)) })),
    result,
  };
}

export type Placement = { groupNumber: number; entryId: string };

/**
 * Two pilots of one round trade groups (a frequency clash, a timekeeper needed elsewhere). Refused,
 * with the reason in the officer's words, when either is not in the round, both fly in one group
 * already, or the swap would put a pilot with someone they are to be kept apart from.
 */
export function swapPilots(p: { round: readonly Placement[]; a: string; b: string; entries: readonly DrawEntry[]; names: ReadonlyMap<string, string> }):
  { ok: true; moves: Placement[] } | { ok: false; reason: string } {
  const name = (id: string) => p.names.get(id) ?? "that pilot";
  if (p.a === p.b) return { ok: false, reason: "Choose two different pilots." };
  const ga = p.round.find((s) => s.entryId === p.a)?.groupNumber;
  const gb = p.round.find((s) => s.entryId === p.b)?.groupNumber;
  if (ga === undefined) return { ok: false, reason: `${name(p.a)} does not fly in this round.` };
  if (gb === undefined) return { ok: false, reason: `${name(p.b)} does not fly in this round.` };
  if (ga === gb) return { ok: false, reason: `${name(p.a)} and ${name(p.b)} already fly in group ${ga}.` };
  const word = new Map(p.entries.map((e) => [e.id, e.keepApart?.toLowerCase() ?? null]));
  const clash = (mover: string, group: number, leaving: string) =>
    p.round.find((s) => s.groupNumber === group && s.entryId !== leaving && word.get(mover) != null && word.get(s.entryId) === word.get(mover));
  const intoB = clash(p.a, gb, p.b);
  if (intoB) return { ok: false, reason: `${name(p.a)} is to be kept apart from ${name(intoB.entryId)}, who flies in group ${gb}.` };
  const intoA = clash(p.b, ga, p.a);
  if (intoA) return { ok: false, reason: `${name(p.b)} is to be kept apart from ${name(intoA.entryId)}, who flies in group ${ga}.` };
  return { ok: true, moves: [{ entryId: p.a, groupNumber: gb }, { entryId: p.b, groupNumber: ga }] };
}
