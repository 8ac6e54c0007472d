"use client";

import { useRef } from "react";
import { describeDetail, describeSync } from "./describe-sync";
import { SyncDetails } from "./sync-details";
import { useOnline } from "./use-online";
import { useSync } from "./sync-provider";

/**
 * The top bar's sync status, always visible: state and unsent count, last sync and the clock
 * bound, and a marker for refused items. Tapping it opens the details with the refused list.
 * Changes are announced politely to screen readers.
 */
export function SyncStatusBadge() {
  const { status, wake } = useSync();
  const dialog = useRef<HTMLDialogElement>(null);
  const online = useOnline();
  const main = describeSync(status, online);
  const refused = status?.rejected.length ?? 0;
  return (
    <>
      <button
        type="button"
        onClick={() => {
          wake(); // the details' "Sync now" needs the client: load it now if the page has not settled yet
          dialog.current?.showModal();
        }}
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

