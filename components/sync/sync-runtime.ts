import { getWindowcallDb } from "@/lib/offline/db";
import { currentDeviceUser } from "@/lib/offline/device-user";
import { requestPersistence } from "@/lib/offline/storage";
import { startSyncInBrowser } from "@/lib/offline/sync-browser";
import { createSyncClient, type SyncClient } from "@/lib/offline/sync-client";

/**
 * The sync provider's heavy half (the sync client, its pull/push loop and the schemas it checks
 * the server's answers with), loaded once the page has settled or on first need (a recorded tap,
 * the sync details opened): see sync-provider.tsx. Which account's database the page uses is
 * decided before it, apart from it (device-user.ts, account-check.ts).
 */

/**
 * A sync client on the database of the account in use, naming that account (read once: a client
 * still finishing a request after a switch must not speak for the new account).
 */
export function newClient(): SyncClient {
  const account = currentDeviceUser();
  return createSyncClient({ db: getWindowcallDb(), fetch: (input, init) => fetch(input, init), account: () => account });
}

/** Starts syncing in the browser (flush on start, on `online`, on becoming visible) and asks for persistent storage once. */
export function startSync(client: SyncClient): () => void {
  const stop = startSyncInBrowser(client);
  void requestPersistence();
  return stop;
}
