import { getMeta, getWindowcallDb, setMeta, type MetaValues } from "@/lib/offline/db";
import { giveOwnDatabase } from "@/lib/offline/device-user";

/**
 * The account check's IndexedDB half, apart from the sync runtime (issue #10): it needs only the
 * device database, which the page's islands open anyway, so it runs as soon as the session is
 * known while the sync runtime (pull/push loop, its schemas) loads once the page has settled.
 *
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
