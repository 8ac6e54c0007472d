"use client";

import type { Ref } from "react";
import type { SyncStatus } from "@/lib/offline/sync-client";
import { dateTimeSecondsText as formatDateTime } from "@/lib/field/clock-text";
import { useSync } from "./sync-provider";

const KIND: Record<SyncStatus["rejected"][number]["kind"], string> = { event: "Tap", run: "Run", session: "Session", discard: "Deleted window" };

/**
 * The sync details sheet: what is waiting, when the device last synced, how far its clock
 * is from the server's, the last error, and every item the server refused with the reason
 * (kept on the device, never resent — SYNC.md §3).
 */
export function SyncDetails({ ref, status }: { ref: Ref<HTMLDialogElement>; status: SyncStatus | null }) {
  const { client } = useSync();
  const rejected = status?.rejected ?? [];
  return (
    <dialog
      ref={ref}
      aria-labelledby="sync-details-title"
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-xl border-2 border-line bg-raised p-4 text-ink backdrop:bg-black/50"
    >
      <h2 id="sync-details-title" className="text-lg font-extrabold">
        Sync
      </h2>
      <dl className="figures mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-muted">State</dt>
        <dd>{status?.state ?? "starting"}</dd>
        <dt className="text-muted">Waiting to send</dt>
        <dd>{status?.unsent ?? 0}</dd>
        <dt className="text-muted">Last sync</dt>
        <dd>{status?.lastSyncAt ? formatDateTime(status.lastSyncAt) : "never"}</dd>
        <dt className="text-muted">Device clock</dt>
        <dd>
          {status?.offset
            ? `${status.offset.thetaMs >= 0 ? "+" : "−"}${Math.abs(Math.round(status.offset.thetaMs))} ms from the server, ±${Math.ceil(status.offset.boundMs)} ms`
            : "not measured yet"}
        </dd>
        {status?.lastError && (
          <>
            <dt className="text-muted">Last problem</dt>
            <dd>{status.lastError}</dd>
          </>
        )}
        {status?.nextRetryAt && (
          <>
            <dt className="text-muted">Next try</dt>
            <dd>{formatDateTime(status.nextRetryAt)}</dd>
          </>
        )}
      </dl>
      <h3 className="mt-4 font-bold">Refused by the server ({rejected.length})</h3>
      {rejected.length === 0 ? (
        <p className="text-sm text-muted">Nothing refused.</p>
      ) : (
        <ul className="mt-1 max-h-64 space-y-2 overflow-y-auto text-sm">
          {rejected.map((r) => (
            <li key={r.id} className="rounded-lg border border-line p-2">
              <span className="font-bold">⚠ {KIND[r.kind]}</span> <span className="text-muted">{r.id.slice(-8)}</span>
              <p>{r.reason}</p>
            </li>
          ))}
        </ul>
      )}
      <form method="dialog" className="mt-4 flex gap-2">
        <button type="button" className="min-h-touch flex-1 rounded-xl border-2 border-ink px-4 font-bold" disabled={!client} onClick={() => void client?.sync()}>
          Sync now
        </button>
        <button className="min-h-touch flex-1 rounded-xl bg-accent px-4 font-bold text-accent-ink">Close</button>
      </form>
    </dialog>
  );
}
