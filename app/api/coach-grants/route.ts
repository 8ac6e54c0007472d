// GET /api/coach-grants — who can see the signed-in pilot's season (grants and open offers); POST — offers it to a coach by e-mail or one-time code
import { db } from "@/db";
import { listPilotGrants, offerByCode, offerByEmail } from "@/db/queries/coach/grants";
import { parseJson, route } from "@/lib/api";
import { coachOfferLimit } from "@/lib/auth/limits";
import { requireUser } from "@/lib/auth/session";
import { ValidationError } from "@/lib/errors";
import { coachOfferSchema } from "@/lib/validations/coach";

export const dynamic = "force-dynamic";
const NO_STORE = { "cache-control": "private, no-store" };

export const GET = route(async () => {
  const user = await requireUser();
  return Response.json({ grants: await listPilotGrants(db, user.id) }, { headers: NO_STORE });
});

/** The reply to an e-mail offer is the same whether or not the address has an account; 429 past 20 offers an hour. */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const input = await parseJson(request, coachOfferSchema);
  if (input.kind === "email") {
    if (input.email === user.email.toLowerCase()) throw new ValidationError("email: that is your own address; you already see your season.");
  }
  const tooMany = await coachOfferLimit(user.id);
  if (tooMany) return tooMany;
  if (input.kind === "email") {
    return Response.json({ offer: await offerByEmail(db, user.id, input.email) }, { status: 201, headers: NO_STORE });
  }
  return Response.json({ offer: await offerByCode(db, user.id) }, { status: 201, headers: NO_STORE });
});
