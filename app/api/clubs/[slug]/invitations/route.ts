// POST /api/clubs/[slug]/invitations — an officer invites someone by e-mail, with a role (a one-time link through the mail queue)
import { parseJson, route } from "@/lib/api";
import { inviteToClub } from "@/lib/auth/club-invitations";
import { invitationLimit } from "@/lib/auth/limits";
import { requireClubRole } from "@/lib/auth/session";
import { clubRef, inviteSchema } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string }> };

/** 401 signed out, 404 not a member, 403 not an officer; 409 when the address is a member already; 429 past the limits. */
export const POST = route(async (request: Request, context: Context) => {
  const me = await requireClubRole(clubRef(await context.params), "officer");
  const input = await parseJson(request, inviteSchema);
  const tooMany = await invitationLimit(me.id, input.email);
  if (tooMany) return tooMany;
  await inviteToClub({ club: me.club, inviter: me, email: input.email, role: input.role });
  return Response.json({ ok: true }, { status: 202, headers: { "cache-control": "no-store" } });
});
