// DELETE /api/clubs/[slug]/fields/[fieldId] — an officer removes one of the club's fields
import { db } from "@/db";
import { removeClubField } from "@/db/queries/club-fields";
import { route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { clubRef, pathId } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string; fieldId: string }> };

/** 401 signed out, 404 not a member or no such field of this club, 403 not an officer. */
export const DELETE = route(async (_request: Request, context: Context) => {
  const params = await context.params;
  const me = await requireClubRole(clubRef(params), "officer");
  const fieldId = pathId(params.fieldId);
  if (!fieldId || !(await removeClubField(db, { clubId: me.clubId, fieldId }))) throw new NotFoundError("No such field in this club.");
  return Response.json({ ok: true }, { headers: { "cache-control": "no-store" } });
});
