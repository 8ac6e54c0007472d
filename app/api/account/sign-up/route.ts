// POST /api/account/sign-up — create an account with e-mail and password
import { db } from "@/db";
import { createUser } from "@/db/queries/users";
import { parseJson, route } from "@/lib/api";
import { hashPassword } from "@/lib/auth/password";
import { signUpSchema } from "@/lib/validations/auth";

export const dynamic = "force-dynamic";

/**
 * The reply is the same whether or not the address already had an account, so sign-up reveals
 * no account's existence; the page then signs in, which succeeds only with the right password.
 */
export const POST = route(async (request: Request) => {
  const input = await parseJson(request, signUpSchema);
  await createUser(db, { email: input.email, name: input.name, passwordHash: await hashPassword(input.password) });
  return Response.json({ ok: true }, { status: 201 });
});
