"use client";

import { useRef } from "react";
import type { SyncStatus } from "@/lib/offline/sync-client";
import { SyncDetails } from "./sync-details";
import { useSync } from "./sync-provider";

const timeFormat = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit" });

/** Short words for the state: an icon alone (or a colour) never carries it. */
export function describeSync(s: SyncStatus | null): { icon: string; label: string; tone: string } {
  if (!s) return { icon: "…", label: "Starting", tone: "text-muted" };
  if (s.state === "signed-out") return { icon: "⊘", label: "Signed out", tone: "text-danger" };
  if (s.state === "syncing" && s.pulling) return { icon: "↻", label: describePull(s.pulling), tone: "text-ink" };
  if (s.state === "syncing") return { icon: "↻", label: "Syncing", tone: "text-ink" };
  if (s.state === "offline") return { icon: "✕", label: s.unsent > 0 ? `Offline · ${s.unsent} unsent` : "Offline", tone: "text-warn" };
  if (s.unsent > 0) return { icon: "↑", label: `${s.unsent} unsent`, tone: "text-warn" };
  if (s.lastError) return { icon: "!", label: "Retrying", tone: "text-warn" };
  return { icon: "✓", label: "Synced", tone: "text-good" };
}

/** "Fetching records… 3 of ~12" (pages), or a count of records when the total is not known. */
export function describePull(p: NonNullable<SyncStatus["pulling"]>): string {
  if (p.pages !== null && p.pages > 1) return `Fetching records… ${p.page} of ~${p.pages}`;
  return `Fetching records… ${p.items}`;
}

/** "synced 14:05 · clock ±12 ms" — the quieter second line. */
export function describeDetail(s: SyncStatus | null): string {
  if (!s) return "";
  const parts = [s.lastSyncAt ? `synced ${timeFormat.format(s.lastSyncAt)}` : "not synced yet"];
  parts.push(s.offset ? `clock ±${Math.ceil(s.offset.boundMs)} ms` : "clock not measured");
  return parts.join(" · ");
}

/**
 * The top bar's sync status, always visible: state and unsent count, last sync and the clock
 * bound, and a marker for refused items. Tapping it opens the details with the refused list.
 * Changes are announced politely to screen readers.
 */
export function SyncStatusBadge() {
  const { status } = useSync();
  const dialog = useRef<HTMLDialogElement>(null);
  const main = describeSync(status);
  const refused = status?.rejected.length ?? 0;
  return (
    <>
      <button
        type="button"
        onClick={() => dialog.current?.showModal()}
        className="flex min-h-11 flex-col items-end rounded-lg px-2 py-1 text-right leading-tight"
        aria-haspopup="dialog"
      >
        <span aria-live="polite" className={`flex items-center gap-1 font-bold ${main.tone}`}>
          <span aria-hidden="true">{main.icon}</span>
          <span>{main.label}</span>
          {refused > 0 && <span className="ml-1 text-danger">· ⚠ {refused} refused</span>}
        </span>
        <span className="figures text-xs text-muted">{describeDetail(status)}</span>
      </button>
      <SyncDetails ref={dialog} status={status} />
    </>
  );
}

export { SyncStatusBadge as SyncStatus };
