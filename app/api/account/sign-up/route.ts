// POST /api/account/sign-up — create an account with e-mail and password
import { db } from "@/db";
import { createUser } from "@/db/queries/users";
import { parseJson, route } from "@/lib/api";
import { signUpLimit } from "@/lib/auth/limits";
import { hashPassword } from "@/lib/auth/password";
import { signUpSchema } from "@/lib/validations/auth";

export const dynamic = "force-dynamic";

/**
 * The reply is the same whether or not the address already had an account (the password is hashed
 * either way, so it takes as long), and so is what the page does next (sign-up-form.tsx): sign-up
 * reveals no account's existence. 429 with Retry-After past 30 sign-ups an hour from one address.
 */
export const POST = route(async (request: Request) => {
  const input = await parseJson(request, signUpSchema);
  const tooMany = await signUpLimit(request);
  if (tooMany) return tooMany;
  await createUser(db, { email: input.email, name: input.name, passwordHash: await hashPassword(input.password) });
  return Response.json({ ok: true }, { status: 201 });
});
