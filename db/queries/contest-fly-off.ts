import "server-only";
import { and, eq, inArray, isNotNull, or } from "drizzle-orm";
import type { Database } from "../index";
import { contestRounds, contests, groupSlots } from "../schema";

export type FlyOffSave = "saved" | "no_fly_off" | "has_results";

/**
 * Draws the fly-off: every qualifier in one group (group 1) of each fly-off round, replacing an
 * earlier fly-off draw (its timekeepers too). When a fly-off slot already holds a result (a paper
 * card or a linked run), nothing changes unless `replaceResults` is set: then those results go with
 * the old draw. The contest's row is locked, so two officers drawing at once take turns.
 */
export async function saveFlyOffDraw(db: Database, p: { contestId: string; entryIds: string[]; replaceResults: boolean }): Promise<FlyOffSave> {
  return db.transaction(async (tx) => {
    await tx.select({ id: contests.id }).from(contests).where(eq(contests.id, p.contestId)).for("update");
    const rounds = await tx.select({ id: contestRounds.id }).from(contestRounds)
      .where(and(eq(contestRounds.contestId, p.contestId), eq(contestRounds.isFlyOff, true)));
    if (rounds.length === 0) return "no_fly_off";
    const ids = rounds.map((r) => r.id);
    if (!p.replaceResults) {
      const [recorded] = await tx.select({ id: groupSlots.id }).from(groupSlots)
        .where(and(inArray(groupSlots.roundId, ids), or(isNotNull(groupSlots.paperFlights), isNotNull(groupSlots.runId)))).limit(1);
      if (recorded) return "has_results";
    }
    await tx.delete(groupSlots).where(inArray(groupSlots.roundId, ids));
    await tx.insert(groupSlots).values(ids.flatMap((roundId) => p.entryIds.map((entryId) => ({ roundId, groupNumber: 1, entryId }))));
    return "saved";
  });
}
