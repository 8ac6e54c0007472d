// POST /api/invitations/accept — follow a club invitation: the signed-in account joins with the invited role
import { parseJson, route } from "@/lib/api";
import { acceptInvitation } from "@/lib/auth/club-invitations";
import { requireUser } from "@/lib/auth/session";
import { tokenBodySchema } from "@/lib/validations/email";

export const dynamic = "force-dynamic";

/**
 * Any signed-in account: the one-time token (256 random bits, stored hashed) is the credential, as
 * for the account links. 410 used or expired, 404 unknown, 409 already a member (link stays unused).
 */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const { token } = await parseJson(request, tokenBodySchema);
  const joined = await acceptInvitation(token, user.id);
  return Response.json({ joined }, { headers: { "cache-control": "no-store" } });
});
