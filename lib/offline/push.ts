import { PUSH_BATCH_SIZE, pushReplySchema } from "@/lib/validations/sync";
import type { ClockEstimate } from "@/lib/clock";
import { listClockEstimates } from "./clock-sync";
import { getMeta, setMeta, type WindowcallDb } from "./db";
import { describeFailure, postJson, requestJson, type FetchLike, type HttpResult } from "./http";
import { applyAcks, listPending, loadPayload, markAttemptFailed, markRejected } from "./outbox";

export type PushDeps = {
  db: WindowcallDb;
  fetch: FetchLike;
  deviceId: string;
  baseUrl?: string;
  /** The account whose device database this is, if known (the server refuses any other session). */
  account?: string | null;
};

/** How a push pass ended: ok with counts, or the failure to report and back off from. */
export type PushOutcome =
  | { kind: "ok"; acked: number; rejected: number }
  | Exclude<HttpResult<unknown>, { kind: "ok" }>;

const newest = (estimates: readonly ClockEstimate[]) =>
  estimates.reduce((m, e) => Math.max(m, e.measuredAtWallMs), Number.NEGATIVE_INFINITY);

/**
 * Send the outbox in queue order, in batches of at most 200, until nothing sendable is left.
 * Entries are deleted only when the server acknowledges them (applied or duplicate);
 * rejected ones are kept with the reason. A failed request counts an attempt on every entry
 * of its batch and ends the pass. Entries the reply does not mention stay queued; a reply
 * that answers for none of the batch is treated as a failure, so the pass cannot spin.
 *
 * Every push carries the device's clock estimates (SYNC.md §4), so the server can
 * interpolate across an offline period; when the outbox is empty but a measurement newer
 * than the last one sent exists, a push with no items carries it alone.
 */
export async function pushOutbox(deps: PushDeps): Promise<PushOutcome> {
  const { db } = deps;
  let acked = 0;
  let rejected = 0;
  let sentOnce = false;
  for (;;) {
    const entries = await listPending(db, PUSH_BATCH_SIZE);
    const clockEstimates = await listClockEstimates(db);
    if (entries.length === 0) {
      if (sentOnce || newest(clockEstimates) <= ((await getMeta(db, "clockSentAt")) ?? Number.NEGATIVE_INFINITY)) {
        return { kind: "ok", acked, rejected };
      }
    }
    const { payload, sentIds, invalid } = await loadPayload(db, entries);
    if (invalid.length > 0) {
      await markRejected(db, invalid);
      rejected += invalid.length;
    }
    if (sentIds.length === 0 && entries.length > 0) continue;

    const body = { deviceId: deps.deviceId, ...(deps.account ? { account: deps.account } : {}), ...payload, clockEstimates };
    const r = await requestJson(deps.fetch, `${deps.baseUrl ?? ""}/api/sync/push`, postJson(body), pushReplySchema);
    if (r.kind !== "ok") {
      await markAttemptFailed(db, sentIds, describeFailure(r));
      return r;
    }
    sentOnce = true;
    if (clockEstimates.length > 0) await setMeta(db, "clockSentAt", newest(clockEstimates));
    if (sentIds.length === 0) continue; // a clock-only push
    const result = await applyAcks(db, sentIds, r.value.acks);
    if (result.answered.size === 0) {
      const failure = { kind: "bad-reply", message: "the server acknowledged none of the items sent" } as const;
      await markAttemptFailed(db, sentIds, describeFailure(failure));
      return failure;
    }
    acked += result.accepted;
    rejected += result.rejected;
    const unanswered = sentIds.filter((id) => !result.answered.has(id));
    if (unanswered.length > 0) await markAttemptFailed(db, unanswered, "not acknowledged by the server");
  }
}
