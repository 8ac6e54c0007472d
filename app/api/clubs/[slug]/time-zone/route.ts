// PUT /api/clubs/[slug]/time-zone — an officer sets the club's time zone (its field days are dates on that clock)
import { db } from "@/db";
import { setClubTimeZone } from "@/db/queries/clubs";
import { parseJson, route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { clubTimeZoneSchema } from "@/lib/validations/club-days";
import { clubRef } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string }> };

/** 401 signed out; 404 not a member; 403 not an officer; 422 a name Intl does not know. 200 with the time zone. */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireClubRole(clubRef(await context.params), "officer");
  const input = await parseJson(request, clubTimeZoneSchema);
  await setClubTimeZone(db, { clubId: me.clubId, timeZone: input.timeZone });
  return Response.json({ timeZone: input.timeZone }, { headers: { "cache-control": "no-store" } });
});
