// PUT /api/clubs/[slug]/day-summaries — a member turns the club's day-summary e-mails on or off for themselves
import { db } from "@/db";
import { setDaySummaries } from "@/db/queries/club-days";
import { parseJson, route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { daySummariesSchema } from "@/lib/validations/club-days";
import { clubRef } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string }> };

/** 401 signed out; 404 not a member (a site admin outside the club too: the setting is a member's). */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireClubRole(clubRef(await context.params), "member");
  const input = await parseJson(request, daySummariesSchema);
  if (!(await setDaySummaries(db, { clubId: me.clubId, userId: me.id, on: input.on }))) throw new NotFoundError("You are not a member of this club.");
  return Response.json({ on: input.on }, { headers: { "cache-control": "no-store" } });
});
