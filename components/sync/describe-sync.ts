import { hourMinuteText as formatTime } from "@/lib/field/clock-text";
import type { SyncStatus } from "@/lib/offline/sync-client";

/**
 * Short words for the sync state: an icon alone (or a colour) never carries it. `online` is the
 * browser's own view (navigator.onLine): with no network the badge says "Offline" at once, even
 * while the client is still between attempts, and counts what waits on this phone.
 */
export function describeSync(s: SyncStatus | null, online = true): { icon: string; label: string; tone: string } {
  if (s?.state === "signed-out") return { icon: "⊘", label: "Signed out", tone: "text-danger" };
  if (!online || s?.state === "offline") {
    const waiting = s?.unsent ?? 0;
    return { icon: "✕", label: waiting > 0 ? `Offline — ${waiting} waiting` : "Offline", tone: "text-warn" };
  }
  if (!s) return { icon: "…", label: "Starting", tone: "text-muted" };
  if (s.state === "syncing" && s.pulling) return { icon: "↻", label: describePull(s.pulling), tone: "text-ink" };
  if (s.state === "syncing") return { icon: "↻", label: "Syncing", tone: "text-ink" };
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
  const parts = [s.lastSyncAt ? `synced ${formatTime(s.lastSyncAt)}` : "not synced yet"];
  parts.push(s.offset ? `clock ±${Math.ceil(s.offset.boundMs)} ms` : "clock not measured");
  return parts.join(" · ");
}
