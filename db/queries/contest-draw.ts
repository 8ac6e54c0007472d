import "server-only";
import { and, count, eq, inArray, isNotNull, isNull, or } from "drizzle-orm";
import type { Database } from "../index";
import { clearFlyOffDraw } from "./contest-fly-off";
import { contestReflights, contestRounds, contests, groupSlots } from "../schema";
import type { Tx } from "./sync-db";

export type DrawSlots = { roundNumber: number; groups: string[][] }[];

/**
 * Replaces the contest's draw with these group lists and records its seed, unless the draw is
 * locked ("locked": nothing changes). Rows for rounds not in the list are removed too. A fly-off
 * drawn from the old preliminary order goes with it (`flyOffCleared`), and while the fly-off has
 * results nothing changes ("fly_off_results"): db/queries/contest-fly-off.ts clearFlyOffDraw.
 * The preliminary rounds' re-flight grants go with the old draw (a grant belongs to the draw it was
 * given in). While a preliminary slot or re-flight holds a result (a card, a linked run or a
 * signature) nothing changes unless `replaceResults` is set: `{ hasResults: n }`, n such results.
 */
export async function saveDraw(db: Database, p: { contestId: string; seed: number; rounds: DrawSlots; replaceResults: boolean }):
  Promise<{ saved: true; flyOffCleared: boolean } | { hasResults: number } | "locked" | "fly_off_results"> {
  return db.transaction(async (tx) => {
    const [row] = await tx.select({ lockedAt: contests.drawLockedAt }).from(contests).where(eq(contests.id, p.contestId)).for("update");
    if (!row || row.lockedAt) return "locked";
    const all = await tx.select({ id: contestRounds.id, number: contestRounds.number, isFlyOff: contestRounds.isFlyOff }).from(contestRounds)
      .where(eq(contestRounds.contestId, p.contestId));
    const rounds = all.filter((r) => !r.isFlyOff);
    const ids = rounds.map((r) => r.id);
    // the fly-off's results are never replaced by this draw (checked first: nothing is deleted yet)
    if ((await countResults(tx, all.filter((r) => r.isFlyOff).map((r) => r.id))) > 0) return "fly_off_results";
    if (!p.replaceResults) {
      const held = await countResults(tx, ids);
      if (held > 0) return { hasResults: held };
    }
    const flyOff = await clearFlyOffDraw(tx, p.contestId);
    if (flyOff === "has_results") return "fly_off_results";
    await tx.update(contests).set({ drawSeed: p.seed }).where(eq(contests.id, p.contestId));
    if (ids.length > 0) {
      await tx.delete(contestReflights).where(inArray(contestReflights.roundId, ids));
      await tx.delete(groupSlots).where(inArray(groupSlots.roundId, ids));
    }
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

/** How many slots and re-flights of these rounds hold a result: a paper card, a linked run or a signature. */
export async function countResults(tx: Tx | Database, roundIds: string[]): Promise<number> {
  if (roundIds.length === 0) return 0;
  const [slots] = await tx.select({ n: count() }).from(groupSlots)
    .where(and(inArray(groupSlots.roundId, roundIds), or(isNotNull(groupSlots.paperFlights), isNotNull(groupSlots.runId), isNotNull(groupSlots.signedAt))));
  const [reflights] = await tx.select({ n: count() }).from(contestReflights)
    .where(and(inArray(contestReflights.roundId, roundIds), or(isNotNull(contestReflights.paperFlights), isNotNull(contestReflights.runId), isNotNull(contestReflights.signedAt))));
  return (slots?.n ?? 0) + (reflights?.n ?? 0);
}

/** The draw's refusal while preliminary results exist, in plain words with how many would go. */
export function hasResultsMessage(n: number): string {
  return `${n === 1 ? "1 result is" : `${n} results are`} already entered in the preliminary rounds (paper cards, timed runs or signatures). A new draw deletes ${n === 1 ? "it" : "them"}: nothing was drawn. Confirm to draw again anyway.`;
}
