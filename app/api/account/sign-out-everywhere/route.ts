// POST /api/account/sign-out-everywhere — sign out every session of the signed-in account, this one included
import { db } from "@/db";
import { bumpSessionVersion } from "@/db/queries/users";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { UnauthorizedError } from "@/lib/errors";
import { signOutEverywhereSchema } from "@/lib/validations/account";

export const dynamic = "force-dynamic";

/** Bumps the account's session generation: every token issued before now is refused on its next request. */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  await parseJson(request, signOutEverywhereSchema);
  if ((await bumpSessionVersion(db, user.id)) === undefined) throw new UnauthorizedError();
  return Response.json({ ok: true }, { headers: { "cache-control": "no-store" } });
});
