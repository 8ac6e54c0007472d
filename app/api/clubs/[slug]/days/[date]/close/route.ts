// POST /api/clubs/[slug]/days/[date]/close — an officer closes the day; the summary goes (once) to members who asked for it
import { db } from "@/db";
import { getDayBoard } from "@/db/queries/club-day-board";
import { closeClubDay } from "@/db/queries/club-days";
import { route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { sendDaySummary } from "@/lib/mail/server/day-summary";
import { dayParam } from "@/lib/validations/club-days";
import { clubRef } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string; date: string }> };

/** 401 signed out; 404 not a member or no day on that date; 403 not an officer. 200 with how many summaries were queued (0 after the first close). */
export const POST = route(async (_request: Request, context: Context) => {
  const params = await context.params;
  const me = await requireClubRole(clubRef(params), "officer");
  const day = dayParam(params.date);
  if (day === null) throw new NotFoundError("No field day on that date.");
  const closed = await closeClubDay(db, { clubId: me.clubId, day, userId: me.id });
  if (!closed) throw new NotFoundError("No field day on that date.");
  if (closed.summaryRecipients.length > 0) {
    await sendDaySummary(me.club, day, await getDayBoard(db, { clubId: me.clubId, day }), closed.summaryRecipients);
  }
  return Response.json({ closedAt: closed.closedAt.toISOString(), summaries: closed.summaryRecipients.length }, { headers: { "cache-control": "no-store" } });
});
