// DELETE /api/clubs/[slug]/invitations/[invitationId] — an officer withdraws an invitation not yet used (its link stops working)
import { db } from "@/db";
import { withdrawInvitation } from "@/db/queries/club-invitations";
import { route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { clubRef, pathId } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string; invitationId: string }> };

/** 401 signed out, 404 not a member (or no such unused invitation of this club), 403 not an officer. */
export const DELETE = route(async (_request: Request, context: Context) => {
  const params = await context.params;
  const me = await requireClubRole(clubRef(params), "officer");
  const invitationId = pathId(params.invitationId);
  if (invitationId === null || !(await withdrawInvitation(db, { clubId: me.clubId, invitationId }))) {
    throw new NotFoundError("No unused invitation of this club with that id.");
  }
  return Response.json({ ok: true }, { headers: { "cache-control": "no-store" } });
});
