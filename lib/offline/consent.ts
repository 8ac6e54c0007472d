import type { ConsentChoice } from "@/lib/sync/consent";
import { laneConsentSchema, type LaneConsent } from "@/lib/validations/consent";
import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import type { StoredRun, WindowcallDb } from "./db";
import { describeFailure, postJson, requestJson, type FetchLike } from "./http";

const replySchema = lazySchema(() => z.object({ consent: laneConsentSchema }));

/**
 * Runs recorded for someone else, on the phone (lib/sync/consent.ts): the lane of `run` that
 * `userId` flies and their standing in it, when someone else recorded it; else null.
 */
export function consentFor(run: StoredRun, userId: string | null): LaneConsent | null {
  if (!userId) return null;
  const mine = run.lanes.find((l) => l.pilotUserId === userId);
  if (!mine) return null;
  const c = run.consents?.find((x) => x.lane === mine.lane);
  if (c) return c.status === "own" ? null : c;
  // pulled before consents existed, or recorded here for someone else: the recorder's id decides
  return run.recordedBy && run.recordedBy.id !== userId ? { lane: mine.lane, status: "pending", reason: null } : null;
}

/** Whether the pilot's logbook lists the run: not when every lane of theirs in it is hidden. */
export function listedInLogbook(run: StoredRun, userId: string | null): boolean {
  return consentFor(run, userId)?.status !== "hidden";
}

/**
 * Sends the pilot's decision (needs a connection: a decision is not a tap on the line, and the
 * recorder should see it at once) and, once the server has it, stores the new standing in the
 * run on this phone so every list changes at once. Returns null when done, else why not.
 */
export async function decideConsent(
  db: WindowcallDb,
  fetchFn: FetchLike,
  params: { runId: string; lane: number; decision: ConsentChoice; reason?: string },
): Promise<string | null> {
  const body = params.decision === "disputed" ? { decision: params.decision, reason: params.reason ?? "" } : { decision: params.decision };
  const r = await requestJson(fetchFn, `/api/runs/${params.runId}/lanes/${params.lane}/consent`, postJson(body), replySchema);
  if (r.kind === "network") return "No connection: decide again when the phone has signal.";
  if (r.kind !== "ok") return r.kind === "http" && r.message ? r.message : describeFailure(r);
  const consent = r.value.consent;
  await db.transaction("rw", db.runs, async () => {
    const run = await db.runs.get(params.runId);
    if (!run) return;
    const others = (run.consents ?? []).filter((c) => c.lane !== consent.lane);
    await db.runs.put({ ...run, consents: [...others, consent].sort((a, b) => a.lane - b.lane) });
  });
  return null;
}
