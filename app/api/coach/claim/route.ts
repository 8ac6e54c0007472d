// POST /api/coach/claim — a coach types in a pilot's one-time code and gets that pilot's grant (404 for a code that is unknown, used, revoked or expired; 429 past 10 tries an hour)
import { db } from "@/db";
import { claimCode } from "@/db/queries/coach/grants";
import { parseJson, route } from "@/lib/api";
import { coachClaimLimit } from "@/lib/auth/limits";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { coachClaimSchema } from "@/lib/validations/coach";

export const dynamic = "force-dynamic";

export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const { code } = await parseJson(request, coachClaimSchema);
  const limited = await coachClaimLimit(request, user.id);
  if (limited) return limited;
  const pilotId = await claimCode(db, user.id, code);
  if (!pilotId) throw new NotFoundError("That code is not good (mistyped, used, revoked or older than a day).");
  return Response.json({ pilotId }, { status: 201 });
});
