// POST /api/account/password — change the signed-in user's password; every session of the account is signed out
import { db } from "@/db";
import { updatePassword } from "@/db/queries/users";
import { parseJson, route } from "@/lib/api";
import { confirmPassword } from "@/lib/auth/confirm-password";
import { hashPassword } from "@/lib/auth/password";
import { requireUser } from "@/lib/auth/session";
import { UnauthorizedError } from "@/lib/errors";
import { changePasswordSchema } from "@/lib/validations/account";

export const dynamic = "force-dynamic";

/**
 * 401 signed out, 422 for a weak or malformed new password, 403 `wrong_password` when the current
 * password is wrong (nothing changes). On success the hash is replaced and the session generation
 * bumped in one statement, so every session of the account, this one included, is signed out;
 * the settings page signs this browser in again with the new password.
 */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const input = await parseJson(request, changePasswordSchema);
  await confirmPassword(user.id, input.currentPassword, request);
  const generation = await updatePassword(db, user.id, await hashPassword(input.newPassword));
  if (generation === undefined) throw new UnauthorizedError();
  return Response.json({ ok: true, signedOut: true }, { headers: { "cache-control": "no-store" } });
});
