import "server-only";
import { and, asc, desc, eq, gte, inArray, isNull, sql } from "drizzle-orm";
import { redrawRemaining, swapPilots, type RoundGroups } from "@/lib/contests/entries-draw";
import type { Database } from "../index";
import { clearFlyOffDraw, FLY_OFF_RESULTS_MESSAGE } from "./contest-fly-off";
import type { Tx } from "./sync-db";
import { contestDrawChanges, contestEntries, contestReflights, contestRounds, contests, groupSlots, users } from "../schema";


export type DrawChangeRefusal = { ok: false; code: "no_draw" | "no_round" | "flown" | "refused" | "too_few" | "fly_off_results"; message: string };

/** The contest's row locked for this change (one change of the draw at a time); false when nothing is drawn. */
async function lockDrawnContest(tx: Tx, contestId: string): Promise<boolean> {
  const r = await tx.execute<{ draw_seed: number | null }>(sql`select draw_seed from contests where id = ${contestId} for update`);
  return r.rows[0]?.draw_seed != null;
}

/**
 * Rounds (not fly-off) of the contest from `from` on, with their slots; `result`: a linked run, a paper card or a
 * signature; `reflightResult`: a re-flight of the round holds one.
 */
async function roundsWithSlots(tx: Tx, contestId: string, from = 1) {
  const rounds = await tx.select({ id: contestRounds.id, number: contestRounds.number }).from(contestRounds)
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, false), gte(contestRounds.number, from)))
    .orderBy(asc(contestRounds.number));
  const slots = rounds.length === 0 ? [] : await tx.select({
    roundId: groupSlots.roundId, entryId: groupSlots.entryId, groupNumber: groupSlots.groupNumber,
    result: sql<boolean>`(${groupSlots.runId} is not null or ${groupSlots.paperFlights} is not null or ${groupSlots.signedAt} is not null)`,
  }).from(groupSlots).where(inArray(groupSlots.roundId, rounds.map((r) => r.id)));
  const reflown = rounds.length === 0 ? [] : await tx.selectDistinct({ roundId: contestReflights.roundId }).from(contestReflights)
    .where(and(inArray(contestReflights.roundId, rounds.map((r) => r.id)),
      sql`(${contestReflights.runId} is not null or ${contestReflights.paperFlights} is not null or ${contestReflights.signedAt} is not null)`));
  return rounds.map((r) => ({ ...r, slots: slots.filter((s) => s.roundId === r.id), reflightResult: reflown.some((x) => x.roundId === r.id) }));
}

const flownRefusal = (n: number, what: string): DrawChangeRefusal =>
  ({ ok: false, code: "flown", message: `Round ${n} has results already: ${what}` });

/**
 * Two pilots of a round trade groups (lib/contests/entries-draw.ts swapPilots says when not), in
 * one transaction with the contest's row locked, and the change is recorded with who and when.
 */
export async function swapInRound(db: Database, p: { contestId: string; roundNumber: number; a: string; b: string; byUserId: string }):
  Promise<{ ok: true; summary: string } | DrawChangeRefusal> {
  return db.transaction(async (tx) => {
    if (!(await lockDrawnContest(tx, p.contestId))) return { ok: false, code: "no_draw", message: "Make the draw first." };
    const round = (await roundsWithSlots(tx, p.contestId, p.roundNumber)).find((r) => r.number === p.roundNumber);
    if (!round) return { ok: false, code: "no_round", message: `The contest has no round ${p.roundNumber}.` };
    if (round.slots.some((s) => s.result) || round.reflightResult) return flownRefusal(p.roundNumber, "its groups can no longer change.");
    const entries = await tx.select({ id: contestEntries.id, keepApart: contestEntries.keepApart, name: contestEntries.pilotName })
      .from(contestEntries).where(eq(contestEntries.contestId, p.contestId));
    const names = new Map(entries.map((e) => [e.id, e.name]));
    const swap = swapPilots({ round: round.slots, a: p.a, b: p.b, entries, names });
    if (!swap.ok) return { ok: false, code: "refused", message: swap.reason };
    for (const move of swap.moves) {
      await tx.update(groupSlots).set({ groupNumber: move.groupNumber }).where(and(eq(groupSlots.roundId, round.id), eq(groupSlots.entryId, move.entryId)));
    }
    const [toB, toA] = swap.moves;
    const summary = `Round ${p.roundNumber}: ${names.get(p.a)} (to group ${toB!.groupNumber}) and ${names.get(p.b)} (to group ${toA!.groupNumber}) traded groups.`;
    await tx.insert(contestDrawChanges).values({ contestId: p.contestId, kind: "swap", roundNumber: p.roundNumber, summary, byUserId: p.byUserId });
    return { ok: true, summary };
  });
}

/**
 * The rounds from `fromRound` on drawn again for today's live entries, the earlier rounds kept and
 * their meetings counted (lib/contests/entries-draw.ts redrawRemaining). Refused when one of those
 * rounds has a result (a slot's or a re-flight's), or the fly-off has one; those rounds' re-flight grants go with them; a fly-off drawn without results is cleared (its
 * pilots came from the old order: contest-fly-off.ts clearFlyOffDraw). Recorded with its seed, who and when.
 */
export async function redrawFrom(db: Database, p: { contestId: string; fromRound: number; seed: number; byUserId: string }):
  Promise<{ ok: true; summary: string; maxMeetings: number; apartBroken: number } | DrawChangeRefusal> {
  return db.transaction(async (tx) => {
    if (!(await lockDrawnContest(tx, p.contestId))) return { ok: false, code: "no_draw", message: "Make the draw first." };
    const all = await roundsWithSlots(tx, p.contestId);
    const remaining = all.filter((r) => r.number >= p.fromRound);
    if (remaining.length === 0) return { ok: false, code: "no_round", message: `The contest has no round ${p.fromRound}.` };
    const flownLater = remaining.find((r) => r.slots.some((s) => s.result) || r.reflightResult);
    if (flownLater) return flownRefusal(flownLater.number, "re-draw from a later round.");
    const flyOff = await clearFlyOffDraw(tx, p.contestId);
    if (flyOff === "has_results") return { ok: false, code: "fly_off_results", message: FLY_OFF_RESULTS_MESSAGE };
    const [{ maxGroupSize }] = await tx.select({ maxGroupSize: contests.maxGroupSize }).from(contests).where(eq(contests.id, p.contestId)) as [{ maxGroupSize: number }];
    const live = await tx.select({ id: contestEntries.id, keepApart: contestEntries.keepApart }).from(contestEntries)
      .where(and(eq(contestEntries.contestId, p.contestId), isNull(contestEntries.withdrawnAt)));
    if (live.length < 2) return { ok: false, code: "too_few", message: "At least 2 pilots must be entered." };
    const flown: RoundGroups[] = all.filter((r) => r.number < p.fromRound).map((r) => {
      const groups = [...new Set(r.slots.map((s) => s.groupNumber))].sort((x, y) => x - y);
      return { roundNumber: r.number, groups: groups.map((g) => r.slots.filter((s) => s.groupNumber === g).map((s) => s.entryId)) };
    });
    const drawn = redrawRemaining({ entries: live, flown, remaining: remaining.map((r) => r.number), maxGroupSize, seed: p.seed });
    // the re-drawn rounds' grants (none with a result, checked above) belong to the old groups
    await tx.delete(contestReflights).where(inArray(contestReflights.roundId, remaining.map((r) => r.id)));
    await tx.delete(groupSlots).where(inArray(groupSlots.roundId, remaining.map((r) => r.id)));
    const values = drawn.rounds.flatMap((r) => {
      const roundId = remaining.find((x) => x.number === r.roundNumber)!.id;
      return r.groups.flatMap((g, gi) => g.map((entryId) => ({ roundId, groupNumber: gi + 1, entryId })));
    });
    if (values.length > 0) await tx.insert(groupSlots).values(values);
    const last = remaining[remaining.length - 1]!.number;
    const span = p.fromRound === last ? `Round ${last}` : `Rounds ${p.fromRound}–${last}`;
    const summary = `${span} drawn again for ${live.length} pilots (seed ${p.seed})${flyOff === "cleared" ? "; the fly-off draw was cleared" : ""}.`;
    await tx.insert(contestDrawChanges).values({ contestId: p.contestId, kind: "redraw", roundNumber: p.fromRound, summary, seed: p.seed, byUserId: p.byUserId });
    return { ok: true, summary, maxMeetings: drawn.result.stats.max, apartBroken: drawn.result.apartBroken };
  });
}

/** The draw's changes, newest first, with the officer's name. */
export async function listDrawChanges(db: Database, contestId: string) {
  return db.select({ id: contestDrawChanges.id, summary: contestDrawChanges.summary, at: contestDrawChanges.at, by: users.name })
    .from(contestDrawChanges).leftJoin(users, eq(users.id, contestDrawChanges.byUserId))
    .where(eq(contestDrawChanges.contestId, contestId)).orderBy(desc(contestDrawChanges.at), desc(contestDrawChanges.id));
}
