// POST /api/account/sign-up — create an account with e-mail and password; mails a verification link (or, for a taken address, a notice to its owner)
import { db } from "@/db";
import { createUser } from "@/db/queries/users";
import { parseJson, route } from "@/lib/api";
import { sendSignUpAttempt, sendVerification } from "@/lib/auth/email-flows";
import { signUpLimit } from "@/lib/auth/limits";
import { hashPassword } from "@/lib/auth/password";
import { signUpSchema } from "@/lib/validations/auth";

export const dynamic = "force-dynamic";

/**
 * The reply is the same whether or not the address already had an account (the password is hashed
 * either way, so it takes as long, and either way one e-mail is queued, not sent, before replying):
 * a new account gets a verification link; the owner of a taken address gets a notice that someone
 * tried, with a way to reset the password. The page says "check your e-mail" in both cases
 * (sign-up-form.tsx). 429 with Retry-After past 30 sign-ups an hour from one address.
 */
export const POST = route(async (request: Request) => {
  const input = await parseJson(request, signUpSchema);
  const tooMany = await signUpLimit(request);
  if (tooMany) return tooMany;
  const user = await createUser(db, { email: input.email, name: input.name, passwordHash: await hashPassword(input.password) });
  if (user) await sendVerification(user);
  else await sendSignUpAttempt(input.email);
  return Response.json({ ok: true }, { status: 201 });
});
