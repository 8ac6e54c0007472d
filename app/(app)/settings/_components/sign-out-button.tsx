"use client";

import { useState } from "react";
import { useSync } from "@/components/sync/sync-provider";
import { Button } from "@/components/ui/button";
import { getWindowcallDb } from "@/lib/offline/db";
import { countKeptAtSignOut } from "@/lib/offline/sign-out";
import { signOutHere } from "./account-session";

/**
 * Signs out and clears this account from the phone (lib/offline/sign-out.ts), so the next person
 * sees none of its records, offline included. Unsent records are first sent if possible; any still
 * unsent are counted, kept sealed, and sent when this account signs in here again. Stays on the
 * origin in use: no redirect from the server, a relative navigation to /sign-in.
 */
/** How long sign-out waits for the sync runtime to load before counting what is still unsent. */
const LOAD_WAIT_MS = 5_000;

export function SignOutButton() {
  const { client, loadClient } = useSync();
  const [unsent, setUnsent] = useState<number | null>(null);
  const [busy, setBusy] = useState(false);

  async function finish() {
    setBusy(true);
    await signOutHere("", client);
  }

  async function start() {
    setBusy(true);
    if (navigator.onLine) {
      // the sync runtime may not have loaded yet (it loads once the page has settled): load it for this last push
      const ready = client ?? (await Promise.race([loadClient(), new Promise<null>((r) => setTimeout(() => r(null), LOAD_WAIT_MS))]));
      await ready?.flush().catch(() => undefined);
    }
    const kept = await countKeptAtSignOut(getWindowcallDb()).catch(() => 0);
    if (kept > 0) {
      setBusy(false);
      return setUnsent(kept);
    }
    await finish();
  }

  if (unsent === null) {
    return (
      <Button variant="secondary" disabled={busy} onClick={() => void start()}>
        {busy ? "Signing out…" : "Sign out"}
      </Button>
    );
  }
  return (
    <div role="alertdialog" aria-labelledby="unsent-h" aria-describedby="unsent-p" className="space-y-3 border-2 border-warn p-3">
      <h2 id="unsent-h" className="font-bold">
        {unsent === 1 ? "1 record not sent yet" : `${unsent} records not sent yet`}
      </h2>
      <p id="unsent-p">
        They stay on this phone, sealed: nobody else who signs in here sees them, and they are sent when you sign in here
        again.
      </p>
      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" disabled={busy} onClick={() => void finish()}>
          {busy ? "Signing out…" : "Sign out and keep them"}
        </Button>
        <Button disabled={busy} onClick={() => setUnsent(null)}>
          Stay signed in
        </Button>
      </div>
    </div>
  );
}
