// POST /api/account/forgot-password — mail a one-time password-reset link to this address, if it has an account
import { parseJson, route } from "@/lib/api";
import { sendPasswordReset } from "@/lib/auth/email-flows";
import { passwordResetLimit } from "@/lib/auth/limits";
import { forgotPasswordSchema } from "@/lib/validations/email";

export const dynamic = "force-dynamic";

/**
 * Public by design (the user cannot sign in). The answer is the same whether or not the address has
 * an account; the limits count every typed address alike (lib/auth/limits.ts), so a 429 tells
 * nothing either. The mail is queued, never sent during the request.
 */
export const POST = route(async (request: Request) => {
  const { email } = await parseJson(request, forgotPasswordSchema);
  const tooMany = await passwordResetLimit(request, email);
  if (tooMany) return tooMany;
  await sendPasswordReset(email);
  return Response.json({ ok: true }, { status: 202 });
});
