// GET /api/account/email — the signed-in user's address and whether it is verified; POST — ask to change it (a link to the new address)
import { db } from "@/db";
import { getEmailState } from "@/db/queries/users";
import { parseJson, route } from "@/lib/api";
import { confirmPassword } from "@/lib/auth/confirm-password";
import { sendEmailChange } from "@/lib/auth/email-flows";
import { accountMailLimit } from "@/lib/auth/limits";
import { requireUser } from "@/lib/auth/session";
import { UnauthorizedError, ValidationError } from "@/lib/errors";
import { changeEmailSchema } from "@/lib/validations/email";

export const dynamic = "force-dynamic";

export const GET = route(async () => {
  const user = await requireUser();
  const state = await getEmailState(db, user.id);
  if (!state) throw new UnauthorizedError();
  return Response.json(state, { headers: { "cache-control": "no-store" } });
});

/**
 * New address + current password (403 `wrong_password`, counted like a sign-in: confirm-password.ts).
 * Nothing changes yet: a confirmation link goes to the new address (POST /api/account/email/confirm
 * makes the change and tells the old one). The answer is the same whether or not another account
 * holds the new address, so it reveals nobody's. 429 past 5 account e-mails an hour.
 */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const input = await parseJson(request, changeEmailSchema);
  if (input.newEmail === user.email) throw new ValidationError("newEmail: That is your address already.", [{ path: "newEmail", message: "That is your address already." }]);
  await confirmPassword(user.id, input.currentPassword, request);
  const tooMany = await accountMailLimit(user.id);
  if (tooMany) return tooMany;
  await sendEmailChange(user, input.newEmail);
  return Response.json({ ok: true }, { status: 202 });
});
