import "server-only";
import { and, eq, inArray, isNotNull, or } from "drizzle-orm";
import type { Database } from "../index";
import { contestReflights, contestRounds, contests, groupSlots } from "../schema";
import type { Tx } from "./sync-db";

export type FlyOffSave = "saved" | "no_fly_off" | "has_results";

/**
 * Draws the fly-off: every qualifier in one group (group 1) of each fly-off round, replacing an
 * earlier fly-off draw (its timekeepers and re-flight grants too). When a fly-off slot or re-flight
 * already holds a result (a paper card, a linked run or a signature), nothing changes unless
 * `replaceResults` is set: then those results go with the old draw. The contest's row is locked, so two officers drawing at once take turns.
 */
export async function saveFlyOffDraw(db: Database, p: { contestId: string; entryIds: string[]; replaceResults: boolean }): Promise<FlyOffSave> {
  return db.transaction(async (tx) => {
    await tx.select({ id: contests.id }).from(contests).where(eq(contests.id, p.contestId)).for("update");
    const rounds = await tx.select({ id: contestRounds.id }).from(contestRounds)
      .where(and(eq(contestRounds.contestId, p.contestId), eq(contestRounds.isFlyOff, true)));
    if (rounds.length === 0) return "no_fly_off";
    const ids = rounds.map((r) => r.id);
    if (!p.replaceResults && (await flyOffHasResults(tx, ids))) return "has_results";
    // the old draw's re-flight grants go with it: a grant belongs to the draw it was given in
    await tx.delete(contestReflights).where(inArray(contestReflights.roundId, ids));
    await tx.delete(groupSlots).where(inArray(groupSlots.roundId, ids));
    await tx.insert(groupSlots).values(ids.flatMap((roundId) => p.entryIds.map((entryId) => ({ roundId, groupNumber: 1, entryId }))));
    return "saved";
  });
}

export type FlyOffClear = "none" | "cleared" | "has_results";

/**
 * A new draw of the preliminary rounds makes the fly-off's pilots (the top of the old preliminary
 * order) stale, so it goes with it: its slots and its re-flight grants are deleted ("cleared"), in
 * the caller's transaction with the contest's row locked. Nothing changes while a fly-off slot or
 * re-flight holds a result (a card, a linked run or a signature): "has_results", and the caller
 * refuses the whole re-draw — results flown on the day are never deleted by a draw of other rounds.
 */
export async function clearFlyOffDraw(tx: Tx, contestId: string): Promise<FlyOffClear> {
  const rounds = await tx.select({ id: contestRounds.id }).from(contestRounds)
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, true)));
  if (rounds.length === 0) return "none";
  const ids = rounds.map((r) => r.id);
  if (await flyOffHasResults(tx, ids)) return "has_results";
  const gone = await tx.delete(groupSlots).where(inArray(groupSlots.roundId, ids)).returning({ id: groupSlots.id });
  await tx.delete(contestReflights).where(inArray(contestReflights.roundId, ids));
  return gone.length > 0 ? "cleared" : "none";
}

/** The refusal's words, the same for a full draw and a re-draw of the remaining rounds. */
export const FLY_OFF_RESULTS_MESSAGE =
  "The fly-off has results already: a new draw of the preliminary rounds would change who qualifies for it. Nothing was drawn again (to draw anyway, draw the fly-off again deleting its results first).";

/** Whether a fly-off slot or re-flight of these rounds holds a result: a card, a linked run or a signature. */
async function flyOffHasResults(tx: Tx, roundIds: string[]): Promise<boolean> {
  const [slot] = await tx.select({ id: groupSlots.id }).from(groupSlots)
    .where(and(inArray(groupSlots.roundId, roundIds), or(isNotNull(groupSlots.paperFlights), isNotNull(groupSlots.runId), isNotNull(groupSlots.signedAt)))).limit(1);
  if (slot) return true;
  const [reflight] = await tx.select({ id: contestReflights.id }).from(contestReflights)
    .where(and(inArray(contestReflights.roundId, roundIds), or(isNotNull(contestReflights.paperFlights), isNotNull(contestReflights.runId), isNotNull(contestReflights.signedAt)))).limit(1);
  return reflight !== undefined;
}
