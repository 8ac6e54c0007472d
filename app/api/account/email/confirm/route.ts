// POST /api/account/email/confirm — follow the link sent to a new address: the account moves to it, the old address is told
import { parseJson, route } from "@/lib/api";
import { confirmEmailChange } from "@/lib/auth/email-flows";
import { tokenBodySchema } from "@/lib/validations/email";

export const dynamic = "force-dynamic";

/**
 * Public by design: the one-time token is the credential (it reached the new inbox). 410 used or
 * expired, 404 unknown, 409 `email_taken` when another account took the address meanwhile.
 * Sessions stay signed in (the account is the same); the next sign-in uses the new address.
 */
export const POST = route(async (request: Request) => {
  const { token } = await parseJson(request, tokenBodySchema);
  const { newEmail } = await confirmEmailChange(token);
  return Response.json({ ok: true, email: newEmail }, { headers: { "cache-control": "no-store" } });
});
