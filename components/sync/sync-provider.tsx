"use client";

import { createContext, Fragment, useContext, useEffect, useState, type ReactNode } from "react";
import { useSessionState } from "@/components/auth/session-state";
import { switchDeviceUser } from "@/lib/offline/device-user";
import type { SyncClient, SyncStatus } from "@/lib/offline/sync-client";
import { useOnline } from "./use-online";

type Runtime = typeof import("./sync-runtime");

/** The page's sync client (null until its code has loaded, just after the page is drawn) and its latest status. */
type SyncContextValue = { client: SyncClient | null; status: SyncStatus | null };

const SyncContext = createContext<SyncContextValue | null>(null);

/**
 * The page's one sync client (SYNC.md §2): created once its code has loaded (sync-runtime.ts,
 * fetched after the page is drawn so no screen waits for it), started in the browser (flush on
 * start, on `online`, on becoming visible), with persistent storage requested once. Also keeps
 * the signed-in user's profile in the device database while online, so pages that open offline
 * know who is timing, and moves to that account's own device database when a different account
 * signs in on this browser (device-user.ts). Nothing here touches storage while rendering.
 */
export function SyncProvider({ children }: { children: ReactNode }) {
  const [runtime, setRuntime] = useState<Runtime | null>(null);
  const [client, setClient] = useState<SyncClient | null>(null);
  const [status, setStatus] = useState<SyncStatus | null>(null);
  // Bumped when another account signs in here: the pages below remount on its database.
  const [generation, setGeneration] = useState(0);
  const { user, status: authStatus } = useSessionState();
  // Signed-out pages call no signed-in API: sync starts once the session is known to be signed
  // in — or, offline (the session cannot be asked for, so it says "unauthenticated"), straight
  // away, so a field page opened with no signal still syncs when the signal returns.
  const online = useOnline();
  // once started it stays started: the signal returning must not stop a client started offline
  const [started, setStarted] = useState(false);
  if (!started && (authStatus === "authenticated" || (authStatus === "unauthenticated" && !online))) setStarted(true);

  useEffect(() => {
    let live = true;
    void import("./sync-runtime").then((loaded) => {
      if (!live) return;
      setRuntime(loaded);
      setClient((c) => c ?? loaded.newClient());
    });
    return () => {
      live = false;
    };
  }, []);
  useEffect(() => client?.subscribe(setStatus), [client]);
  useEffect(() => {
    if (!started || !client || !runtime) return;
    return runtime.startSync(client);
  }, [client, started, runtime]);

  useEffect(() => {
    if (authStatus !== "authenticated" || !user?.id || !runtime || !client) return;
    // Another account signed in (rare): the stored choice changed outside React, so the client
    // and the pages below must follow it now.
    const follow = () => {
      setStatus(null);
      setClient(runtime.newClient());
      setGeneration((g) => g + 1);
    };
    if (switchDeviceUser(user.id)) {
      follow();
      return; // this effect runs again with the new client
    }
    const profile = { id: user.id, name: user.name, email: user.email };
    void runtime.keepProfile(profile, follow).catch(() => undefined);
    // signed in again after the server said 401: leave the signed-out state and sync
    if (client.status().state === "signed-out") void client.resume();
  }, [authStatus, user?.id, user?.name, user?.email, client, runtime]);

  return (
    <SyncContext.Provider value={{ client, status }}>
      <Fragment key={generation}>{children}</Fragment>
    </SyncContext.Provider>
  );
}

/** The sync client (null until loaded) and its latest status (null until the first report). */
export function useSync(): SyncContextValue {
  const value = useContext(SyncContext);
  if (!value) throw new Error("useSync needs <SyncProvider> above it");
  return value;
}
