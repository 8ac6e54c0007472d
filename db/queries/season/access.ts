import "server-only";
import type { Database } from "../../index";
import { holdsGrant } from "../coach/grants";

/**
 * Who may read a pilot's season (the Season screen and its exports): the pilot themself, and a
 * coach holding the pilot's unrevoked grant (db/queries/coach/grants.ts). Every season route
 * follows this one function; anyone else gets a 404 from the route, so nobody learns whose
 * seasons exist. A revoked grant counts for nothing from the moment it is revoked.
 */
export async function canReadSeason(db: Database, params: { viewerId: string; pilotId: string }): Promise<boolean> {
  if (params.viewerId === params.pilotId) return true;
  return holdsGrant(db, params.viewerId, params.pilotId);
}
