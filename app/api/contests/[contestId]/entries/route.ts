// POST /api/contests/[contestId]/entries — a signed-in member of the contest's club enters, with up to five hangar models (F3K.2.3);
// with an entry fee, the reply carries the Checkout page to pay on (the entry waits unpaid until the webhook says paid)
import { db } from "@/db";
import { enterPilot, getContest } from "@/db/queries/contests";
import { parseJson, route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError, ValidationError } from "@/lib/errors";
import { appLink } from "@/lib/mail/links";
import { checkoutExpiry, entriesOpen } from "@/lib/payments/fees";
import { startCheckout } from "@/lib/payments/server/checkout";
import { contestIdSchema, enterSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string }> };

/** 401 signed out, 404 no such contest or not a member, 409 entered already or entries closed, 422 a model not in the pilot's hangar, 502 the payments service failed (the entry stays, unpaid). */
export const POST = route(async (request: Request, context: Context) => {
  await requireUser();
  const body = await parseJson(request, enterSchema);
  const params = contestIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  const me = await requireContestRole(params.data.contestId, "member");
  const found = await getContest(db, params.data.contestId);
  if (!found) throw new NotFoundError();
  const { contest } = found;
  if (!entriesOpen(contest, new Date())) throw new ConflictError("entries_closed", "Entries for this contest are closed.");
  const row = await enterPilot(db, { contestId: contest.id, userId: me.id, pilotName: me.name ?? me.email, modelIds: body.modelIds, pilotClass: body.pilotClass });
  if (row === "taken") throw new ConflictError("entered", "You are entered already.");
  if (row === "models") throw new ValidationError("Choose models from your own hangar.");
  const checkout = contest.entryFeeCents === null ? null : await startCheckout({
    entryId: row.id, contestId: contest.id, contestName: contest.name, feeCents: contest.entryFeeCents, currency: contest.currency, origin: new URL(appLink("/")).origin, expiresAt: checkoutExpiry(contest, new Date()),
  });
  return Response.json({ entry: { id: row.id }, checkoutUrl: checkout?.url ?? null }, { status: 201, headers: { "cache-control": "no-store" } });
});
