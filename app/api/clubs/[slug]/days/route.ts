// POST /api/clubs/[slug]/days — an officer opens a field day at one of the club's fields
import { db } from "@/db";
import { openClubDay } from "@/db/queries/club-days";
import { parseJson, route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { openClubDaySchema } from "@/lib/validations/club-days";
import { clubRef } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string }> };

/** 401 signed out, 404 not a member or not the club's field, 403 not an officer; 409 the date is closed; 201 opened, 200 already open. */
export const POST = route(async (request: Request, context: Context) => {
  const me = await requireClubRole(clubRef(await context.params), "officer");
  const input = await parseJson(request, openClubDaySchema);
  const opened = await openClubDay(db, { clubId: me.clubId, fieldId: input.fieldId, day: input.day, userId: me.id });
  if (!opened) throw new NotFoundError();
  if (opened === "closed") throw new ConflictError("day_closed", "The club closed that date's field day; its runs and summary are final.");
  return Response.json({ day: opened.day }, { status: opened.created ? 201 : 200, headers: { "cache-control": "no-store" } });
});
