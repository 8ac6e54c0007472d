import "server-only";
import { and, eq, inArray, isNull } from "drizzle-orm";
import type { Database } from "../index";
import { clearFlyOffDraw } from "./contest-fly-off";
import { contestRounds, contests, groupSlots } from "../schema";

export type DrawSlots = { roundNumber: number; groups: string[][] }[];

/**
 * Replaces the contest's draw with these group lists and records its seed, unless the draw is
 * locked ("locked": nothing changes). Rows for rounds not in the list are removed too. A fly-off
 * drawn from the old preliminary order goes with it (`flyOffCleared`), and while the fly-off has
 * results nothing changes ("fly_off_results"): db/queries/contest-fly-off.ts clearFlyOffDraw.
 */
export async function saveDraw(db: Database, p: { contestId: string; seed: number; rounds: DrawSlots }):
  Promise<{ saved: true; flyOffCleared: boolean } | "locked" | "fly_off_results"> {
  return db.transaction(async (tx) => {
    const [row] = await tx.select({ lockedAt: contests.drawLockedAt }).from(contests).where(eq(contests.id, p.contestId)).for("update");
    if (!row || row.lockedAt) return "locked";
    const flyOff = await clearFlyOffDraw(tx, p.contestId);
    if (flyOff === "has_results") return "fly_off_results";
    await tx.update(contests).set({ drawSeed: p.seed }).where(eq(contests.id, p.contestId));
    const rounds = await tx.select({ id: contestRounds.id, number: contestRounds.number }).from(contestRounds)
      .where(and(eq(contestRounds.contestId, p.contestId), eq(contestRounds.isFlyOff, false)));
    if (rounds.length > 0) await tx.delete(groupSlots).where(inArray(groupSlots.roundId, rounds.map((r) => r.id)));
    const values = p.rounds.flatMap((r) => {
      const round = rounds.find((x) => x.number === r.roundNumber)!;
      return r.groups.flatMap((g, gi) => g.map((entryId) => ({ roundId: round.id, groupNumber: gi + 1, entryId })));
    });
    if (values.length > 0) await tx.insert(groupSlots).values(values);
    return { saved: true, flyOffCleared: flyOff === "cleared" };
  });
}

/** Locks the draw (idempotent); false when the contest has no draw yet. */
export async function lockDraw(db: Database, contestId: string): Promise<boolean> {
  const [row] = await db.select({ seed: contests.drawSeed, locked: contests.drawLockedAt }).from(contests).where(eq(contests.id, contestId));
  if (!row || row.seed === null) return false;
  if (!row.locked) await db.update(contests).set({ drawLockedAt: new Date() }).where(and(eq(contests.id, contestId), isNull(contests.drawLockedAt)));
  return true;
}
