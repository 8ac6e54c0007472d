// GET /api/clubs/[slug]/days/[date] — the Day board: every member's runs of the club's field day, aggregated on the server
import { db } from "@/db";
import { getDayBoard } from "@/db/queries/club-day-board";
import { route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { dayParam } from "@/lib/validations/club-days";
import { clubRef } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string; date: string }> };

/** 401 signed out; 404 not a member, no such club, a date that is not one, or no day open on it. */
export const GET = route(async (_request: Request, context: Context) => {
  const params = await context.params;
  const me = await requireClubRole(clubRef(params), "member");
  const day = dayParam(params.date);
  if (day === null) throw new NotFoundError("No field day on that date.");
  const board = await getDayBoard(db, { clubId: me.clubId, day });
  if (!board) throw new NotFoundError("No field day on that date.");
  return Response.json(board, { headers: { "cache-control": "no-store" } });
});
