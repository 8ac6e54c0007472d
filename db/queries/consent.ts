import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { consentStatus, type ConsentChoice } from "@/lib/sync/consent";
import type { LaneConsent } from "@/lib/validations/consent";
import type { Database } from "../index";
import { laneConsents, runLanes, runs } from "../schema";
import { lockRuns, syncStamp } from "./sync-db";

export type ConsentOutcome = { kind: "decided"; consent: LaneConsent } | { kind: "not-found" } | { kind: "own" };

/**
 * The pilot's decision on a lane someone else recorded for them (lib/sync/consent.ts). Only that
 * lane's pilot finds it (anyone else: not-found, so nobody learns which runs exist); a lane the
 * pilot recorded themselves needs no decision ("own"). Deciding again replaces the decision;
 * "pending" removes it (a hidden run listed again, waiting for a decision). The run's row is
 * locked and re-stamped (syncStamp), so the pilot's phones, the recorder and coaches
 * pull the new standing (sync-pull.ts).
 */
export async function decideLaneConsent(
  db: Database,
  params: { userId: string; runId: string; lane: number; decision: ConsentChoice; reason: string | null },
): Promise<ConsentOutcome> {
  return db.transaction(async (tx) => {
    await lockRuns(tx, [params.runId]);
    const [row] = await tx
      .select({ createdBy: runs.createdBy })
      .from(runLanes)
      .innerJoin(runs, eq(runs.id, runLanes.runId))
      .where(and(eq(runLanes.runId, params.runId), eq(runLanes.lane, params.lane), eq(runLanes.pilotUserId, params.userId)));
    if (!row) return { kind: "not-found" };
    if (row.createdBy === params.userId) return { kind: "own" };
    const reason = params.decision === "disputed" ? params.reason : null;
    const decision = params.decision === "pending" ? null : params.decision;
    if (decision === null) {
      await tx.delete(laneConsents).where(and(eq(laneConsents.runId, params.runId), eq(laneConsents.lane, params.lane)));
    } else {
      await tx
        .insert(laneConsents)
        .values({ runId: params.runId, lane: params.lane, pilotUserId: params.userId, status: decision, reason })
        .onConflictDoUpdate({
          target: [laneConsents.runId, laneConsents.lane],
          set: { status: decision, reason, pilotUserId: params.userId, decidedAt: sql`now()` },
        });
    }
    await tx.update(runs).set(syncStamp()).where(eq(runs.id, params.runId));
    const status = consentStatus(row.createdBy, params.userId, decision) ?? "pending";
    return { kind: "decided", consent: { lane: params.lane, status, reason } };
  });
}
