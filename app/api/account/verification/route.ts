// POST /api/account/verification — send the signed-in user a new verification link (Settings' "resend")
import { db } from "@/db";
import { getEmailState } from "@/db/queries/users";
import { parseJson, route } from "@/lib/api";
import { sendVerification } from "@/lib/auth/email-flows";
import { accountMailLimit } from "@/lib/auth/limits";
import { requireUser } from "@/lib/auth/session";
import { resendVerificationSchema } from "@/lib/validations/email";

export const dynamic = "force-dynamic";

/** 200 `{ sent: true }`, or `{ sent: false }` when the address is verified already; 429 past 5 an hour. */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  await parseJson(request, resendVerificationSchema);
  const state = await getEmailState(db, user.id);
  if (!state || state.verified) return Response.json({ sent: false });
  const tooMany = await accountMailLimit(user.id);
  if (tooMany) return tooMany;
  await sendVerification(user);
  return Response.json({ sent: true });
});
