// POST /api/account/verify-email — follow a verification link: marks the address it was sent to verified
import { parseJson, route } from "@/lib/api";
import { verifyEmail } from "@/lib/auth/email-flows";
import { tokenBodySchema } from "@/lib/validations/email";

export const dynamic = "force-dynamic";

/**
 * Public by design: the one-time token (256 random bits, stored hashed) is the credential, and the
 * link is opened wherever the mail is read, signed in or not. 410 when used or expired, 404 unknown.
 */
export const POST = route(async (request: Request) => {
  const { token } = await parseJson(request, tokenBodySchema);
  await verifyEmail(token);
  return Response.json({ ok: true }, { headers: { "cache-control": "no-store" } });
});
