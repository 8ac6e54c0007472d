import type { TaskDefinition } from "@/lib/tasks";
import {
  DROP_FROM_ROUNDS, finalResults, MIN_VALID_ROUNDS, normaliseUnits, rankFlyOff, rankPilots, rankTeams,
  type FinalPlace, type HalfRounding, type Standing,
} from "@/lib/scoring";
import type { ReflightPlacement } from "@/lib/events/schema";
import { standingResult } from "@/lib/scoring/reflight";
import { paperCardResult } from "./paper-card";
import { roundPenalty, type OfficerPenalty } from "./penalties";

export type StandingsRound = { id: string; number: number; isFlyOff: boolean; task: TaskDefinition };
export type StandingsEntry = { id: string; name: string; team: string | null; withdrawn: boolean; pilotClass?: "senior" | "junior" };
/** A result as recorded: a paper card's flight times, or the linked run lane's server result, and its signature. */
export type RecordedResult = {
  /** The server's result of the linked run's lane (run_lanes.result_tenths, derived by lib/results runResult); null when none. */
  runResultTenths: number | null;
  /** A paper card's flight times (tenths); when present they are the result. */
  paperFlights: readonly number[] | null;
  signed: boolean;
  /**
   * Penalty points that count on the linked run's lane, given on the timekeeper's phone (`penalty`
   * events; run_lanes.derived by lib/results runResult, which applies F3K.4.3's highest-per-attempt and
   * F3K.4.1). They count only while that run is the record (a paper card with flights outranks it).
   */
  runPenaltyPoints?: number;
};
export type StandingsSlot = RecordedResult & {
  roundId: string;
  groupNumber: number;
  entryId: string;
  /** The paper card's penalty points (one number per card). */
  penaltyPoints: number;
  /** Officers' penalties one by one (contest_penalties, removed ones left out); summed by lib/contests/penalties.ts roundPenalty. */
  officerPenalties?: readonly OfficerPenalty[];
  /** A re-flight granted in this round (F3K.9.6), with its own result and signature; absent = none. */
  reflight?: StandingsReflight | null;
  /** An officer recorded a dispute about this result and it is still open (lib/contests/disputes.ts); absent = none. */
  disputed?: boolean;
  /** The slot or its re-flight grant has a second record waiting for the officer's decision (lib/contests/records.ts); absent = none. */
  undecided?: boolean;
};
export type StandingsReflight = RecordedResult & {
  placement: ReflightPlacement;
  /** False for a group mate flying again with the re-flyer (keeps the better of two, F3K.9.6). */
  entitled: boolean;
  /** The group it is flown in: when the re-flight stands, its result is normalised there. */
  groupNumber: number;
};
export type StandingsInput = {
  rounds: readonly StandingsRound[];
  entries: readonly StandingsEntry[];
  slots: readonly StandingsSlot[];
  /** "f3k": lowest round dropped from 6 flown (F3K.10); "none": every round counts. */
  dropRule: string;
  /** How exact halves of 0.1 point round when a round's task does not say (its `halves` setting wins; default half-up). */
  halves?: HalfRounding;
};

/** One pilot's round: the task result, the points it scored in its group, how it was recorded. */
export type RoundCell = {
  roundNumber: number;
  groupNumber: number | null;
  /** The task result in tenths of a second; null = not recorded yet. */
  resultTenths: number | null;
  /** Round points in tenths of a point (0 when unsigned, F3K.1.2); null = not recorded yet. */
  pointsTenths: number | null;
  signed: boolean;
  source: "paper" | "run" | null;
  /** Every penalty point of the round: the paper card's or officer's plus the phone's (F3K.10: subtracted from the total, dropped round or not). */
  penaltyPoints: number;
  /** Of those, the points given on the timekeeper's phone (the linked run's and the re-flight's run's). */
  phonePenaltyPoints: number;
  /** An officer's penalty for contact with a person at launch: the round scores 0 (F3K.4.1), plus the penalty. */
  zeroedByPenalty: boolean;
  dropped: boolean;
  /** A re-flight with a recorded result: both results (tenths; 0 when unsigned) and which one stands (F3K.9.6). */
  reflight?: { placement: ReflightPlacement; originalTenths: number; reflightTenths: number; stands: "original" | "reflight" } | null;
  /** A dispute about this result is open: shown as "result under dispute" (no names; public too). */
  disputed: boolean;
  /** Two records wait for the officer's decision (RECORDS_UNDECIDED; public too). */
  undecided: boolean;
};
export type PilotRow = Omit<Standing, "pilotId"> & { entryId: string; name: string; team: string | null; rounds: RoundCell[]; withdrawn: boolean };
export type Standings = {
  /** Rounds with at least one recorded result, in order (the ones that count so far). */
  rounds: { number: number; letter: string | null; name: string }[];
  pilots: PilotRow[];
  /** F3K.10: at least 5 rounds flown. */
  valid: boolean;
  /** The fly-off's table once it is drawn (null: none planned, or not drawn yet). */
  flyOff: { rounds: { number: number; letter: string | null; name: string }[]; pilots: PilotRow[]; counted: boolean } | null;
  /** The final order: fly-off pilots first when the fly-off counts (F3K.10), then the preliminary order. */
  final: (FinalPlace & { name: string })[];
  /** F3K.10.4: each team's three best members' final scores (preliminary totals), in tenths. */
  teams: { team: string; rank: number; totalTenths: number; counted: string[] }[];
  /** The juniors in the final order, ranked among themselves (common practice: one contest, a junior ranking beside it). */
  juniors: { entryId: string; name: string; rank: number; overallRank: number }[];
};

type Scored = Map<string, Map<string, Omit<RoundCell, "roundNumber" | "dropped">>>;

type Recorded = { source: "paper" | "run" | null; resultTenths: number | null };

/** A recorded result: a paper card's flights through the task engine, else the linked run's server result. */
function recorded(task: TaskDefinition, r: { paperFlights: readonly number[] | null; runResultTenths: number | null }): Recorded {
  if (r.paperFlights !== null) return { source: "paper", resultTenths: paperCardResult(task, r.paperFlights).tenths };
  return r.runResultTenths !== null ? { source: "run", resultTenths: r.runResultTenths } : { source: null, resultTenths: null };
}

/**
 * The result that stands for one slot, and the group it counts in: the first flight's, or, once a
 * re-flight has a result, the one lib/scoring/reflight.ts standingResult picks (F3K.9.6). An
 * unsigned result is compared as zero (F3K.1.2).
 */
function standing(task: TaskDefinition, s: StandingsSlot) {
  const first = recorded(task, s);
  // the phone's penalties count while its run is the record; a re-flight's run's too (our reading: a penalty given in either flight stays, as in a dropped round, F3K.10)
  const phone = (first.source === "run" ? s.runPenaltyPoints ?? 0 : 0);
  const base = { group: s.groupNumber, ...first, signed: s.signed, reflight: null as RoundCell["reflight"], phonePenalty: phone };
  if (!s.reflight) return base;
  const again = recorded(task, s.reflight);
  if (again.resultTenths === null) return base;
  const phonePenalty = phone + (again.source === "run" ? s.reflight.runPenaltyPoints ?? 0 : 0);
  const originalTenths = first.resultTenths !== null && s.signed ? first.resultTenths : 0;
  const reflightTenths = s.reflight.signed ? again.resultTenths : 0;
  const pick = standingResult({ original: originalTenths, reflight: reflightTenths, placement: s.reflight.placement, entitled: s.reflight.entitled });
  const reflight = { placement: s.reflight.placement, originalTenths, reflightTenths, stands: pick.stands };
  return pick.stands === "reflight"
    ? { group: s.reflight.groupNumber, ...again, signed: s.reflight.signed, reflight, phonePenalty }
    : { ...base, reflight, phonePenalty };
}

/**
 * Each slot's standing result (paper card through the task engine, else the linked run's; a
 * re-flight's when it stands, F3K.9.6) and its points, normalised per group it was flown in (F3K.9.1).
 */
function scoreSlots(input: StandingsInput): Scored {
  const byRound: Scored = new Map();
  for (const round of input.rounds) {
    const cells = new Map<string, Omit<RoundCell, "roundNumber" | "dropped">>();
    const slots = input.slots.filter((s) => s.roundId === round.id).map((slot) => ({ slot, ...standing(round.task, slot) }));
    for (const group of new Set(slots.map((s) => s.group))) {
      const inGroup = slots.filter((s) => s.group === group).map((x) => ({
        ...x, penalty: roundPenalty({ cardPoints: x.slot.penaltyPoints, officer: x.slot.officerPenalties ?? [], phonePoints: x.phonePenalty }),
      }));
      // F3K.1.2: a result not signed by pilot and timekeeper scores zero (so it is nobody's best either); F3K.4.1: so does a round an officer's launch-contact penalty zeroes.
      const counts = (x: (typeof inGroup)[number]) => x.resultTenths !== null && x.signed && !x.penalty.zeroesRound;
      const points = normaliseUnits(inGroup.map((x) => (counts(x) ? x.resultTenths! : 0)), round.task.halves ?? input.halves);
      inGroup.forEach((x, i) => cells.set(x.slot.entryId, {
        groupNumber: group, resultTenths: x.resultTenths, pointsTenths: x.resultTenths === null ? null : points[i]!,
        signed: x.signed, source: x.source, penaltyPoints: x.penalty.points, phonePenaltyPoints: x.penalty.phonePoints, zeroedByPenalty: x.penalty.zeroesRound,
        reflight: x.reflight, disputed: x.slot.disputed ?? false,
        undecided: x.slot.undecided ?? false,
      }));
    }
    byRound.set(round.id, cells);
  }
  return byRound;
}

const roundLabel = (r: StandingsRound) => ({ number: r.number, letter: r.task.letter ?? null, name: r.task.name });

function pilotRows(rounds: readonly StandingsRound[], scored: Scored, entries: readonly StandingsEntry[], dropFrom: number, flyOff: boolean): PilotRow[] {
  const rowsIn = entries.map((e) => {
    const cells = rounds.map((r): RoundCell => {
      const c = scored.get(r.id)?.get(e.id);
      return { roundNumber: r.number, groupNumber: c?.groupNumber ?? null, resultTenths: c?.resultTenths ?? null, pointsTenths: c?.pointsTenths ?? null,
        signed: c?.signed ?? false, source: c?.source ?? null, penaltyPoints: c?.penaltyPoints ?? 0, phonePenaltyPoints: c?.phonePenaltyPoints ?? 0, zeroedByPenalty: c?.zeroedByPenalty ?? false, dropped: false, reflight: c?.reflight ?? null, disputed: c?.disputed ?? false,
        undecided: c?.undecided ?? false };
    });
    return { entry: e, cells };
  });
  const toPoints = (cells: RoundCell[]) => cells.map((c) => (c.pointsTenths ?? 0) / 10);
  const entriesIn = rowsIn.map(({ entry, cells }) => ({ pilotId: entry.id, rounds: toPoints(cells), penalties: cells.reduce((sum, c) => sum + c.penaltyPoints, 0) }));
  const ranked = flyOff ? rankFlyOff(entriesIn) : rankPilots(entriesIn, { dropFrom });
  // Pilots sharing a place are listed by name (the ranking breaks nothing between them).
  const listed = ranked.map((r) => ({ r, name: rowsIn.find((x) => x.entry.id === r.pilotId)!.entry.name }))
    .sort((a, b) => a.r.rank - b.r.rank || a.name.localeCompare(b.name))
    .map((x) => x.r);
  return listed.map(({ pilotId, ...standing }) => {
    const { entry, cells } = rowsIn.find((r) => r.entry.id === pilotId)!;
    const marked = cells.map((c, i) => ({ ...c, dropped: standing.dropped?.index === i }));
    return { ...standing, entryId: entry.id, name: entry.name, team: entry.team, rounds: marked, withdrawn: entry.withdrawn };
  });
}

/**
 * A contest's standings from its draw and recorded results (pure): each round normalised per
 * group, best = 1000 (F3K.9.1, F3K.10); an unsigned result scores zero (F3K.1.2); totals with
 * the lowest round dropped from 6 flown and every penalty subtracted, dropped round included
 * (F3K.10); ties broken by the better dropped score, else flagged for a fly-off (F3K.10);
 * fly-off rounds ranked on their own, no preliminary points or penalties carried (F3K.10),
 * counting once 3 rounds are complete; teams by their three best members (F3K.10.4).
 * Only rounds with at least one recorded result count (live standings during the day).
 */
export function contestStandings(input: StandingsInput): Standings {
  const scored = scoreSlots(input);
  const hasResult = (r: StandingsRound) => [...(scored.get(r.id)?.values() ?? [])].some((c) => c.resultTenths !== null);
  const prelimRounds = input.rounds.filter((r) => !r.isFlyOff && hasResult(r)).sort((a, b) => a.number - b.number);
  const withResults = new Set(input.slots.filter((s) => s.paperFlights !== null || s.runResultTenths !== null).map((s) => s.entryId));
  const drawn = new Set(input.slots.map((s) => s.entryId));
  const entries = input.entries.filter((e) => withResults.has(e.id) || (!e.withdrawn && drawn.has(e.id)));
  const dropFrom = input.dropRule === "none" ? Number.POSITIVE_INFINITY : DROP_FROM_ROUNDS;
  const pilots = pilotRows(prelimRounds, scored, entries, dropFrom, false);

  const flyOffAll = input.rounds.filter((r) => r.isFlyOff).sort((a, b) => a.number - b.number);
  let flyOff: Standings["flyOff"] = null;
  let final: FinalPlace[];
  // A fly-off planned but not drawn yet (no pilot in its rounds) has no table: the preliminary order stands.
  const flyers = entries.filter((e) => input.slots.some((s) => s.entryId === e.id && flyOffAll.some((r) => r.id === s.roundId)));
  if (flyers.length > 0) {
    // A fly-off round counts once every fly-off pilot still flying has a result in it (lib/scoring finalResults).
    // A pilot who withdrew keeps the rounds flown and scores 0 in the others (common practice; RULES.md
    // is silent): a withdrawal must not keep the remaining rounds from ever being complete.
    const complete = flyOffAll.filter((r) => hasResult(r) && flyers.every((e) => e.withdrawn || scored.get(r.id)?.get(e.id)?.resultTenths != null));
    const flyRows = pilotRows(complete, scored, flyers, Number.POSITIVE_INFINITY, true);
    const result = finalResults(
      pilots.map((p) => ({ ...p, pilotId: p.entryId })),
      flyRows.map((p) => ({ pilotId: p.entryId, rounds: p.rounds.map((c) => (c.pointsTenths ?? 0) / 10), penalties: p.rounds.reduce((sum, c) => sum + c.penaltyPoints, 0) })),
    );
    flyOff = { rounds: complete.map(roundLabel), pilots: flyRows, counted: result.flyOffCounted };
    final = result.places;
  } else {
    final = finalResults(pilots.map((p) => ({ ...p, pilotId: p.entryId })), []).places;
  }
  const names = new Map(entries.map((e) => [e.id, e.name]));
  const teamNames = [...new Set(entries.map((e) => e.team).filter((t): t is string => !!t))];
  const teams = rankTeams(
    teamNames.map((team) => ({ teamId: team, memberIds: entries.filter((e) => e.team === team).map((e) => e.id) })),
    pilots.map((p) => ({ pilotId: p.entryId, totalTenths: p.totalTenths })),
  ).map((t) => ({ team: t.teamId, rank: t.rank, totalTenths: t.totalTenths, counted: t.countedMemberIds.map((id) => names.get(id) ?? "?") }));

  const junior = new Set(entries.filter((e) => e.pilotClass === "junior").map((e) => e.id));
  const juniors = juniorRanking(final.filter((f) => junior.has(f.pilotId))).map((j) => ({ ...j, name: names.get(j.entryId) ?? "?" }));

  return {
    rounds: prelimRounds.map(roundLabel),
    pilots,
    valid: prelimRounds.length >= MIN_VALID_ROUNDS,
    flyOff,
    final: final.map((f) => ({ ...f, name: names.get(f.pilotId) ?? "?" })),
    teams,
    juniors,
  };
}

/** Places among a class, from the final order: a tie in the final order (same rank) stays a tie. */
function juniorRanking(places: readonly FinalPlace[]): { entryId: string; rank: number; overallRank: number }[] {
  let rank = 0;
  return places.map((p, i) => {
    if (i === 0 || p.rank !== places[i - 1]!.rank) rank = i + 1;
    return { entryId: p.pilotId, rank, overallRank: p.rank };
  });
}
