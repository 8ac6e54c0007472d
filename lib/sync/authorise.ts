import { ConflictError } from "@/lib/errors";
import { OFFICER_DEVICE_PREFIX, type EventBody } from "@/lib/events/schema";

/**
 * Who may write what in a push (SYNC.md §3; the server checks every item). Pure decisions
 * on facts the caller looked up; each returns null when allowed, else the reason the device
 * shows beside the refused item.
 */

export type RunFacts = { id: string; createdBy: string; lanes: readonly { lane: number; pilotUserId: string | null }[] };
export type TargetFacts = { runId: string; recordedBy: string; deviceId?: string } | null;

/**
 * An event may be written by the run's creator (its timekeeper: any event) or by a pilot of
 * one of its lanes (self-timing: their own lane's events, the run's signals, and undo or
 * correction of events they recorded themselves). Lane events must name a lane of the run;
 * undo and corrections must name an event of the same run already on the server.
 */
export function eventRefusal(userId: string, run: RunFacts, body: EventBody, target: TargetFacts): string | null {
  const isCreator = run.createdBy === userId;
  const ownLanes = new Set(run.lanes.filter((l) => l.pilotUserId === userId).map((l) => l.lane));
  if (!isCreator && ownLanes.size === 0) return "You neither created this run nor fly in it.";
  if ("lane" in body) {
    if (!run.lanes.some((l) => l.lane === body.lane)) return `Lane ${body.lane + 1} is not part of this run.`;
    if (!isCreator && !ownLanes.has(body.lane)) return `Only the run's timekeeper or lane ${body.lane + 1}'s pilot may record for that lane.`;
    return null;
  }
  if (body.kind === "void" && body.setAside) return "Only an officer sets a penalty aside, on the contest's round page.";
  if (body.kind === "void" || body.kind === "correct") {
    if (!target || target.runId !== run.id) return "The event it amends is not in this run on the server.";
    if (target.deviceId?.startsWith(OFFICER_DEVICE_PREFIX)) return "An officer's decision is not changed from a phone.";
    if (!isCreator && target.recordedBy !== userId) return "Only the run's timekeeper may amend someone else's record.";
  }
  return null;
}

/**
 * Whether the user may add a run to this session: only their own. (A club's field day gathers its
 * members' runs from their own sessions by field and date, db/queries/club-day-board.ts; nobody
 * adds runs to another's session.)
 */
export function runSessionRefusal(userId: string, session: { ownerId: string } | null): string | null {
  if (!session) return "Its session is not on the server (sessions are sent first, so it was refused or never sent).";
  if (session.ownerId === userId) return null;
  return "You can add runs only to your own sessions.";
}

/**
 * A lane may name as pilot the run's creator or someone who shares a club with them: naming
 * a stranger would put runs into their logbook. Anyone else is timed as a named guest. An id
 * that names no account gets the very same answer as a stranger's, so a push cannot be used to
 * learn which account ids exist.
 */
export function pilotRefusal(userId: string, lane: number, pilotUserId: string, sharesClub: boolean, exists: boolean): string | null {
  if (exists && (pilotUserId === userId || sharesClub)) return null;
  return `Lane ${lane + 1}: that pilot is not in a club with you; time them as a named guest.`;
}

/**
 * A shared phone keeps one device database per account (lib/offline/device-user.ts). A request
 * that names the database's account must come from that account's session: otherwise another
 * account's records would be sent, or the device id claimed, under the wrong session.
 */
export function assertSameAccount(sessionUserId: string, account: string | undefined): void {
  if (account !== undefined && account !== sessionUserId) {
    throw new ConflictError("other_account", "This phone's records belong to another account: sign in as that account to sync them.");
  }
}
