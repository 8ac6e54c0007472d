// PUT /api/clubs/[slug]/days/[date]/decisions — an officer decides a lane two phones recorded differently: whose record stands, or a note
import { db } from "@/db";
import { getDayBoard } from "@/db/queries/club-day-board";
import { recordDayDecision } from "@/db/queries/club-day-decisions";
import { lateSummaryRecipients } from "@/db/queries/club-days";
import { parseJson, route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { NotFoundError, ValidationError } from "@/lib/errors";
import { sendLateDecisionSummary } from "@/lib/mail/server/day-summary";
import { dayDecisionSchema, dayParam } from "@/lib/validations/club-days";
import { clubRef } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string; date: string }> };

/**
 * 401 signed out; 404 not a member, no day on that date, or a lane the day's board does not list as
 * recorded differently; 403 not an officer; 422 bad input or a phone that did not record the lane.
 * 200 with the decision as stored (who and when). A decision that changes the record standing after the
 * day's summary went queues the updated summary to the members who ask for summaries (a repeated PUT
 * of the same decision changes nothing and mails nobody).
 */
export const PUT = route(async (request: Request, context: Context) => {
  const params = await context.params;
  const me = await requireClubRole(clubRef(params), "officer");
  const input = await parseJson(request, dayDecisionSchema);
  const day = dayParam(params.date);
  if (day === null) throw new NotFoundError("No field day on that date.");
  const board = await getDayBoard(db, { clubId: me.clubId, day });
  if (!board) throw new NotFoundError("No field day on that date.");
  const lane = board.disagreements.find((d) => d.runId === input.runId && d.lane === input.lane);
  if (!lane) throw new NotFoundError("That lane is not one two phones recorded differently on this day.");
  if (input.deviceId !== null && !lane.versions.some((v) => v.deviceId === input.deviceId)) {
    throw new ValidationError("Choose one of the phones that recorded this lane.", [{ path: "deviceId", message: "Not a phone that recorded this lane." }]);
  }
  const recorded = await recordDayDecision(db, { clubId: me.clubId, day, runId: input.runId, lane: input.lane, deviceId: input.deviceId, note: input.note, userId: me.id });
  // decided after the summary went (the day closed): the summary again, once per change of the record that stands
  if (recorded.recordChanged) {
    const to = await lateSummaryRecipients(db, { clubId: me.clubId, day });
    const after = to.length > 0 ? await getDayBoard(db, { clubId: me.clubId, day }) : null;
    if (after) await sendLateDecisionSummary(me.club, day, { runId: input.runId, lane: input.lane, deviceId: input.deviceId, before: board, after }, to);
  }
  return Response.json({ decision: recorded.decision }, { headers: { "cache-control": "no-store" } });
});
