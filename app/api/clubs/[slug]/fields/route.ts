// POST /api/clubs/[slug]/fields — an officer adds a field the club flies at, with its cautions
import { db } from "@/db";
import { addClubField } from "@/db/queries/club-fields";
import { parseJson, route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { ConflictError } from "@/lib/errors";
import { clubFieldSchema, clubRef } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string }> };

/** 401 signed out, 404 not a member, 403 not an officer, 409 when the club has a field of that name. */
export const POST = route(async (request: Request, context: Context) => {
  const me = await requireClubRole(clubRef(await context.params), "officer");
  const field = await parseJson(request, clubFieldSchema);
  const row = await addClubField(db, me.clubId, field);
  if (row === "taken") throw new ConflictError("field_taken", "The club has a field of that name already.");
  return Response.json({ field: row }, { status: 201, headers: { "cache-control": "no-store" } });
});
