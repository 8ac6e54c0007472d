"use client";

import { createContext, Fragment, useCallback, useContext, useEffect, useRef, useState, type ReactNode } from "react";
import { useSessionState } from "@/components/auth/session-state";
import { switchDeviceUser } from "@/lib/offline/device-user";
import type { SyncClient, SyncStatus } from "@/lib/offline/sync-client";
import { useOnline } from "./use-online";
import { whenSettled } from "./when-settled";

type Runtime = typeof import("./sync-runtime");

/**
 * The page's sync client (null until its code has loaded: once the page has settled, or sooner on
 * first need), its latest status, and `wake` to load it now.
 */
type SyncContextValue = { client: SyncClient | null; status: SyncStatus | null; wake: () => void; loadClient: () => Promise<SyncClient> };

const SyncContext = createContext<SyncContextValue | null>(null);

/**
 * The page's one sync client (SYNC.md §2), started in the browser (flush on start, on `online`, on
 * becoming visible), with persistent storage requested once. Two halves, in this order (issue #10):
 *
 * 1. **The account check**, as soon as the session is known: which account's device database this
 *    page uses (device-user.ts, localStorage, synchronous) and whether that database holds another
 *    account's records (account-check.ts, one IndexedDB read). Either one switching remounts the
 *    pages below on the right database (`generation`) — early, before anyone types into a form.
 *    It also keeps the signed-in user's profile in the device database, so pages that open
 *    offline know who is timing.
 * 2. **The sync runtime** (sync-runtime.ts: the pull/push loop, its schemas, the pull's writes),
 *    loaded once the page has settled (`whenSettled`) or on first need (`wake`: a recorded tap, the
 *    sync details opened), so its evaluation and the first pull are not part of the page's load.
 *    Nothing waits for it: taps are stored in IndexedDB by the screens themselves, and the client
 *    flushes the outbox when it starts.
 *
 * Signed-out pages (online) load neither. Nothing here touches storage while rendering.
 */
export function SyncProvider({ children }: { children: ReactNode }) {
  const [runtime, setRuntime] = useState<Runtime | null>(null);
  const runtimeRef = useRef<Runtime | null>(null);
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
  // the runtime is wanted once the page has settled after sync started, or at once on first need
  const [wanted, setWanted] = useState(false);
  const wake = useCallback(() => setWanted(true), []);
  // `loadClient`: the client now (loading the runtime if it has not loaded yet), for work that needs it at once (sign-out's last push)
  const clientRef = useRef<SyncClient | null>(null);
  const waiters = useRef<((c: SyncClient) => void)[]>([]);
  const loadClient = useCallback((): Promise<SyncClient> => {
    if (clientRef.current) return Promise.resolve(clientRef.current);
    setWanted(true);
    return new Promise((resolve) => waiters.current.push(resolve));
  }, []);

  useEffect(() => {
    if (!started || wanted) return;
    return whenSettled(() => setWanted(true));
  }, [started, wanted]);

  useEffect(() => {
    if (!wanted) return;
    let live = true;
    void import("./sync-runtime").then((loaded) => {
      if (!live) return;
      runtimeRef.current = loaded;
      setRuntime(loaded);
      setClient((c) => c ?? loaded.newClient());
    });
    return () => {
      live = false;
    };
  }, [wanted]);
  useEffect(() => client?.subscribe(setStatus), [client]);
  useEffect(() => {
    if (!started || !client || !runtime) return;
    return runtime.startSync(client);
  }, [client, started, runtime]);
  useEffect(() => {
    clientRef.current = client;
    if (!client) return;
    const waiting = waiters.current;
    waiters.current = [];
    for (const resolve of waiting) resolve(client);
  }, [client]);

  // The account check: needs the session, not the runtime.
  useEffect(() => {
    if (authStatus !== "authenticated" || !user?.id) return;
    let live = true;
    // Another account signed in (rare): the stored choice changed outside React, so the client
    // (if loaded) and the pages below must follow it now.
    const follow = () => {
      if (!live) return;
      setStatus(null);
      setClient(runtimeRef.current ? runtimeRef.current.newClient() : null);
      setGeneration((g) => g + 1);
    };
    if (switchDeviceUser(user.id)) {
      follow();
      return; // this effect runs again on the next generation's render
    }
    const profile = { id: user.id, name: user.name, email: user.email };
    void import("./account-check").then((check) => (live ? check.keepProfile(profile, follow) : undefined)).catch(() => undefined);
    return () => {
      live = false;
    };
  }, [authStatus, user?.id, user?.name, user?.email, generation]);

  // signed in again after the server said 401: leave the signed-out state and sync
  useEffect(() => {
    if (authStatus === "authenticated" && client?.status().state === "signed-out") void client.resume();
  }, [authStatus, client]);

  return (
    <SyncContext.Provider value={{ client, status, wake, loadClient }}>
      <Fragment key={generation}>{children}</Fragment>
    </SyncContext.Provider>
  );
}

/** The sync client (null until loaded), its latest status (null until the first report), `wake` to load it now, and `loadClient` to wait for it. */
export function useSync(): SyncContextValue {
  const value = useContext(SyncContext);
  if (!value) throw new Error("useSync needs <SyncProvider> above it");
  return value;
}
