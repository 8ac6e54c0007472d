// POST /api/coach/claim — a coach types in a pilot's one-time code and gets that pilot's grant (404 for a code that is unknown, used, revoked or expired)
import { db } from "@/db";
import { claimCode } from "@/db/queries/coach/grants";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { coachClaimSchema } from "@/lib/validations/coach";

export const dynamic = "force-dynamic";

export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const { code } = await parseJson(request, coachClaimSchema);
  const pilotId = await claimCode(db, user.id, code);
  if (!pilotId) throw new NotFoundError("That code is not good (mistyped, used, revoked or older than a day).");
  return Response.json({ pilotId }, { status: 201 });
});
