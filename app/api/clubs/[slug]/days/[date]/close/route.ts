// POST /api/clubs/[slug]/days/[date]/close — an officer closes the day; the summary goes (once) to members who asked for it
import { db } from "@/db";
import { getDayBoard } from "@/db/queries/club-day-board";
import { closeClubDay } from "@/db/queries/club-days";
import { route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { dayLabel, daySummaryLines } from "@/lib/days/summary";
import { NotFoundError } from "@/lib/errors";
import { appLink } from "@/lib/mail/links";
import { daySummaryMail } from "@/lib/mail/messages";
import { sendMail } from "@/lib/mail/server/send";
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
    const board = await getDayBoard(db, { clubId: me.clubId, day });
    const timeOfDay = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", timeZone: board?.timeZone ?? "UTC" });
    const lines = board ? daySummaryLines(board, (id) => board.people[id] ?? "a member", (ms) => timeOfDay.format(ms), board.timeZone) : [];
    const mail = daySummaryMail({
      clubName: me.club.name, dayText: dayLabel(day), lines,
      boardLink: appLink(`/clubs/${me.club.slug}/days/${day}`), unsubscribe: `${appLink(`/clubs/${me.club.slug}`)}#day-summaries`, // the setting, on the club page
    });
    for (const to of closed.summaryRecipients) await sendMail(to.email, mail);
  }
  return Response.json({ closedAt: closed.closedAt.toISOString(), summaries: closed.summaryRecipients.length }, { headers: { "cache-control": "no-store" } });
});
