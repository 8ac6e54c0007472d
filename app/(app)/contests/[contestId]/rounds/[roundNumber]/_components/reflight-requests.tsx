"use client";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";
import type { ReflightCause, ReflightPlacement } from "@/lib/events/schema";
import { REFLIGHT_CAUSE_WORDS, REFLIGHT_PLACEMENT_WORDS } from "@/lib/field/ruling-words";
import { formatClock } from "@/lib/format";

/** As contest_reflight_requests.status: "withdrawn" when the timekeeper undid the ruling on the phone before anyone decided. */
type ReflightRequestStatus = "open" | "granted" | "dismissed" | "withdrawn";

export type ReflightRequestRow = {
  id: string; entryId: string; name: string; cause: ReflightCause; placement: ReflightPlacement; reason: string | null;
  askedBy: string | null; askedAt: string; status: ReflightRequestStatus; decidedBy: string | null; decidedAt: string | null;
};

/**
 * Re-flights asked for on a timekeeper's phone (a `reflight` ruling on a contest duty's lane): "asked on the
 * phone by <timekeeper> at <club clock time>, cause …". Granting stays the officer's decision (F3K.9.6): one
 * button grants it as asked (cause and placement from the phone; a later group is the one after the pilot's),
 * one dismisses it; who and when are kept either way.
 */
export function ReflightRequests(p: { contestId: string; roundKey: string; timeZone: string; requests: ReflightRequestRow[]; groupOf: Record<string, number> }) {
  if (p.requests.length === 0) return null;
  return (
    <section aria-labelledby="reflight-requests-title" className="space-y-3 rounded-xl border-2 border-line p-3">
      <h2 id="reflight-requests-title" className="text-xl font-bold">Re-flights asked on the phones</h2>
      <p className="text-sm text-muted">A timekeeper&apos;s ruling is a request: granting a re-flight is the contest director&apos;s decision (F3K.9.6).</p>
      <ul className="space-y-3">{p.requests.map((r) => <RequestItem key={r.id} {...p} r={r} />)}</ul>
    </section>
  );
}

const DECIDED_WORDS: Record<Exclude<ReflightRequestStatus, "open">, string> = {
  granted: "Granted", dismissed: "Dismissed", withdrawn: "Withdrawn on the phone (the ruling was undone)",
};

function RequestItem(p: { contestId: string; roundKey: string; timeZone: string; r: ReflightRequestRow; groupOf: Record<string, number> }) {
  const { r } = p;
  const { send, busy, error } = useSend();
  const url = `/api/contests/${p.contestId}/rounds/${p.roundKey}/reflight-requests`;
  const own = p.groupOf[r.entryId] ?? 1;
  const groupNumber = r.placement === "later-group" ? own + 1 : own;
  const asked = `asked on the phone by ${r.askedBy ?? "a former timekeeper"} at ${formatClock(new Date(r.askedAt), p.timeZone, "short")}`;
  return (
    <li aria-label={`Re-flight request, ${r.name}`} className="space-y-1 rounded-lg border border-line p-2">
      <p className="font-semibold">{r.name}: {asked}, cause {REFLIGHT_CAUSE_WORDS[r.cause]}, {REFLIGHT_PLACEMENT_WORDS[r.placement].label}{r.reason ? ` · ${r.reason}` : ""}</p>
      {r.status === "open" ? (
        <div className="flex flex-wrap gap-2">
          <Button type="button" disabled={busy} onClick={() => void send("PUT", url, { requestId: r.id, decision: "grant", placement: r.placement, groupNumber, entitled: true, reason: r.reason })}>
            Grant {r.name}&apos;s re-flight{r.placement === "original-group" ? "" : ` (group ${groupNumber})`}
          </Button>
          <Button type="button" variant="danger" disabled={busy} onClick={() => void send("PUT", url, { requestId: r.id, decision: "dismiss" })}>Dismiss</Button>
        </div>
      ) : (
        <p className="text-sm text-muted">{DECIDED_WORDS[r.status]} by {r.decidedBy ?? (r.status === "withdrawn" ? "a former timekeeper" : "a former officer")}{r.decidedAt ? ` at ${formatClock(new Date(r.decidedAt), p.timeZone, "short")}` : ""}.</p>
      )}
      <FormError message={error} />
    </li>
  );
}
