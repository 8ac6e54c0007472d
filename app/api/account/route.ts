// DELETE /api/account — delete the signed-in account (password confirmation); others' records keep its results without the name
import { db } from "@/db";
import { deleteAccount } from "@/db/queries/account-delete";
import { listOwnLogKeys } from "@/db/queries/altimeter";
import { deleteObject } from "@/lib/storage/server/s3";
import { parseJson, route } from "@/lib/api";
import { confirmPassword } from "@/lib/auth/confirm-password";
import { requireUser } from "@/lib/auth/session";
import { UnauthorizedError } from "@/lib/errors";
import { deleteAccountSchema } from "@/lib/validations/account";

export const dynamic = "force-dynamic";

/**
 * 401 signed out, 422 without a password, 403 `wrong_password` with a wrong one (nothing changes).
 * What is removed and what is kept anonymously: db/queries/account-delete.ts. Every session of
 * the account is signed out; the settings page then signs this browser out.
 */
export const DELETE = route(async (request: Request) => {
  const user = await requireUser();
  const input = await parseJson(request, deleteAccountSchema);
  await confirmPassword(user.id, input.password, request);
  const logKeys = await listOwnLogKeys(db, { ownerId: user.id });
  if (!(await deleteAccount(db, user.id))) throw new UnauthorizedError();
  // the altimeter files go too (their rows went with the account); a failure leaves an unreachable object, logged
  const gone = await Promise.allSettled(logKeys.map((key) => deleteObject(key)));
  for (const g of gone) if (g.status === "rejected") console.error("[account] could not delete a log file", g.reason);
  return Response.json({ ok: true }, { headers: { "cache-control": "no-store" } });
});
