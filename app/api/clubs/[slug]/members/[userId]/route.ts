// PATCH /api/clubs/[slug]/members/[userId] — an officer changes a member's role; DELETE — an officer removes a member, or a member leaves
import { db } from "@/db";
import { changeMembership, type MembershipChange } from "@/db/queries/club-members";
import { parseJson, route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { hasClubRole } from "@/lib/clubs/roles";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { changeRoleSchema, clubRef, pathId } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string; userId: string }> };

function answer(outcome: MembershipChange, leaving: boolean): Response {
  if (outcome === "not-member") throw new NotFoundError("No such member in this club.");
  if (outcome === "last-officer") {
    throw new ConflictError(
      "last_officer",
      leaving ? "You are the club's only officer: name another officer before you leave." : "A club keeps at least one officer: name another officer first.",
    );
  }
  return Response.json({ ok: true }, { headers: { "cache-control": "no-store" } });
}

/** 401 signed out, 404 not a member (or no such member), 403 not an officer, 409 when it would leave no officer. */
export const PATCH = route(async (request: Request, context: Context) => {
  const params = await context.params;
  const me = await requireClubRole(clubRef(params), "officer");
  const { role } = await parseJson(request, changeRoleSchema);
  const userId = pathId(params.userId);
  if (!userId) throw new NotFoundError("No such member in this club.");
  return answer(await changeMembership(db, { clubId: me.clubId, userId, role }), false);
});

/** Anyone may leave (their own id); only an officer removes someone else. The last officer stays. */
export const DELETE = route(async (_request: Request, context: Context) => {
  const params = await context.params;
  const me = await requireClubRole(clubRef(params), "member");
  const userId = pathId(params.userId);
  if (!userId) throw new NotFoundError("No such member in this club.");
  const leaving = userId === me.id;
  if (!leaving && !hasClubRole(me.clubRole, "officer") && me.role !== "admin") throw new ForbiddenError("Only the club's officers may remove a member.");
  return answer(await changeMembership(db, { clubId: me.clubId, userId, role: null }), leaving);
});
