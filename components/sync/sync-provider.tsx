"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { useSession } from "next-auth/react";
import { createContext, Fragment, useContext, useEffect, useState, type ReactNode } from "react";
import { getMeta, getWindowcallDb, setMeta, type MetaValues } from "@/lib/offline/db";
import { currentDeviceUser, giveOwnDatabase, switchDeviceUser } from "@/lib/offline/device-user";
import { requestPersistence } from "@/lib/offline/storage";
import { startSyncInBrowser } from "@/lib/offline/sync-browser";
import { useOnline } from "./use-online";
import { createSyncClient, type SyncClient, type SyncStatus } from "@/lib/offline/sync-client";

type SyncContextValue = { client: SyncClient; status: SyncStatus | null };

const SyncContext = createContext<SyncContextValue | null>(null);

/**
 * The page's one sync client (SYNC.md §2): created once, started in the browser (flush on
 * start, on `online`, on becoming visible), with persistent storage requested once. Also
 * keeps the signed-in user's profile in the device database while online, so pages that
 * open offline know who is timing, and moves to that account's own device database when a
 * different account signs in on this browser (device-user.ts). Constructing the client
 * touches no storage, so this is safe to render on the server; it starts only in an effect.
 */
export function SyncProvider({ children }: { children: ReactNode }) {
  const [client, setClient] = useState(newClient);
  const [status, setStatus] = useState<SyncStatus | null>(null);
  // Bumped when another account signs in here: the pages below remount on its database.
  const [generation, setGeneration] = useState(0);
  const { data: session, status: authStatus } = useSession();
  // Signed-out pages call no signed-in API: sync starts once the session is known to be signed
  // in — or, offline (next-auth cannot ask the server, so it says "unauthenticated"), straight
  // away, so a field page opened with no signal still syncs when the signal returns.
  const online = useOnline();
  // once started it stays started: the signal returning must not stop a client started offline
  const [started, setStarted] = useState(false);
  if (!started && (authStatus === "authenticated" || (authStatus === "unauthenticated" && !online))) setStarted(true);

  useEffect(() => client.subscribe(setStatus), [client]);
  useEffect(() => {
    if (!started) return;
    const stop = startSyncInBrowser(client);
    void requestPersistence();
    return stop;
  }, [client, started]);

  const user = session?.user;
  useEffect(() => {
    if (authStatus !== "authenticated" || !user?.id) return;
    // Another account signed in (rare): the stored choice changed outside React, so the client
    // and the pages below must follow it now.
    const follow = () => {
      setStatus(null);
      setClient(newClient());
      setGeneration((g) => g + 1);
    };
    if (switchDeviceUser(user.id)) {
      follow();
      return; // this effect runs again with the new client
    }
    const profile = { id: user.id, name: user.name ?? "", email: user.email ?? "" };
    const db = getWindowcallDb();
    void (async () => {
      const cached = await getMeta(db, "profile");
      // This database holds another account's records (localStorage was cleared): use a fresh one.
      if (cached && cached.id !== profile.id) return giveOwnDatabase(profile.id) ? follow() : undefined;
      if (cached?.name !== profile.name || cached.email !== profile.email) await setMeta(db, "profile", profile);
    })().catch(() => undefined);
    // signed in again after the server said 401: leave the signed-out state and sync
    if (client.status().state === "signed-out") void client.resume();
  }, [authStatus, user?.id, user?.name, user?.email, client]);

  return (
    <SyncContext.Provider value={{ client, status }}>
      <Fragment key={generation}>{children}</Fragment>
    </SyncContext.Provider>
  );
}


/**
 * A sync client on the database of the account in use, naming that account (read once: a client
 * still finishing a request after a switch must not speak for the new account).
 */
function newClient(): SyncClient {
  const account = currentDeviceUser();
  return createSyncClient({ db: getWindowcallDb(), fetch: (input, init) => fetch(input, init), account: () => account });
}

/** The sync client and its latest status (null until the first report). */
export function useSync(): SyncContextValue {
  const value = useContext(SyncContext);
  if (!value) throw new Error("useSync needs <SyncProvider> above it");
  return value;
}

/** The signed-in user as last seen online (undefined while loading, null if never cached). */
export function useLocalProfile(): MetaValues["profile"] | null | undefined {
  return useLiveQuery(async () => (await getMeta(getWindowcallDb(), "profile")) ?? null, []);
}
