// POST /api/account/reset-password — follow a reset link: set a new password and sign out every session of the account
import { parseJson, route } from "@/lib/api";
import { resetPassword } from "@/lib/auth/email-flows";
import { resetPasswordSchema } from "@/lib/validations/email";

export const dynamic = "force-dynamic";

/**
 * Public by design: the one-time token (45 minutes, single use, stored hashed) is the credential.
 * The password is argon2id-hashed, the session generation bumped (every session ends) and every
 * other reset link of the account retired, in one transaction. 410 used or expired, 404 unknown.
 */
export const POST = route(async (request: Request) => {
  const input = await parseJson(request, resetPasswordSchema);
  await resetPassword(input.token, input.password);
  return Response.json({ ok: true }, { headers: { "cache-control": "no-store" } });
});
