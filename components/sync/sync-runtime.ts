import { getMeta, getWindowcallDb, setMeta, type MetaValues } from "@/lib/offline/db";
import { currentDeviceUser, giveOwnDatabase } from "@/lib/offline/device-user";
import { requestPersistence } from "@/lib/offline/storage";
import { startSyncInBrowser } from "@/lib/offline/sync-browser";
import { createSyncClient, type SyncClient } from "@/lib/offline/sync-client";

/**
 * The sync provider's heavy half (the device database, the sync client and the schemas it
 * checks the server's answers with), loaded once the page is drawn: no screen needs it to
 * paint, and the first load of every signed-in page stays small.
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

/**
 * Keeps the signed-in user's profile in the device database, so pages that open offline know
 * who is timing; calls `follow` when this database holds another account's records
 * (localStorage was cleared) and a fresh one was chosen.
 */
export async function keepProfile(profile: MetaValues["profile"], follow: () => void): Promise<void> {
  const db = getWindowcallDb();
  const cached = await getMeta(db, "profile");
  if (cached && cached.id !== profile.id) {
    if (giveOwnDatabase(profile.id)) follow();
    return;
  }
  if (cached?.name !== profile.name || cached.email !== profile.email) await setMeta(db, "profile", profile);
}
