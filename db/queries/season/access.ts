import "server-only";
import type { Database } from "../../index";

/**
 * Who may read a pilot's season (the Season screen and its exports): for now only the pilot
 * themself. The coach desk widens this one function (a coach holding the pilot's unrevoked
 * grant), and every season route follows; anyone else gets a 404 from the route, so nobody
 * learns whose seasons exist.
 */
export async function canReadSeason(_db: Database, params: { viewerId: string; pilotId: string }): Promise<boolean> {
  return params.viewerId === params.pilotId;
}
