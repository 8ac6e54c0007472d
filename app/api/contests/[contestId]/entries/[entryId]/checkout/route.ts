// POST /api/contests/[contestId]/entries/[entryId]/checkout — the entry's own pilot starts (again) paying its fee: a new Checkout page
import { db } from "@/db";
import { entryOfContest } from "@/db/queries/contest-payments";
import { route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { appLink } from "@/lib/mail/links";
import { checkoutExpiry } from "@/lib/payments/fees";
import { startCheckout } from "@/lib/payments/server/checkout";
import { entryIdSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; entryId: string }> };

/** 401 signed out, 404 no such contest or live entry of the caller's own (nobody pays for another's card entry), 409 no fee or paid already, 502 the payments service failed. */
export const POST = route(async (_request: Request, context: Context) => {
  const user = await requireUser();
  const params = entryIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "member");
  const found = await entryOfContest(db, params.data);
  if (!found || found.entry.pilotUserId !== user.id || found.entry.withdrawnAt) throw new NotFoundError("No such entry.");
  const { entry, contest } = found;
  if (contest.entryFeeCents === null) throw new ConflictError("no_fee", "This contest has no entry fee.");
  if (entry.paymentStatus === "paid" || entry.paymentStatus === "refunded") throw new ConflictError("paid", "This entry is paid already.");
  const checkout = await startCheckout({
    entryId: entry.id, contestId: contest.id, contestName: contest.name, feeCents: contest.entryFeeCents, currency: contest.currency, origin: new URL(appLink("/")).origin, expiresAt: checkoutExpiry(contest, new Date()),
  });
  return Response.json({ checkoutUrl: checkout.url }, { status: 201, headers: { "cache-control": "no-store" } });
});
