// PATCH /api/contests/[contestId]/entries/[entryId] — an officer sets an entry's team and class
// DELETE /api/contests/[contestId]/entries/[entryId] — an officer withdraws an entry (kept, marked withdrawn), or a pilot their own
// while entries are open and the draw is not locked; a card payment is given back when entries are still open (before the deadline)
import { db } from "@/db";
import { entryOfContest, withdrawWithRefund } from "@/db/queries/contest-payments";
import { changeEntry } from "@/db/queries/contests";
import { parseJson, route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { hasClubRole } from "@/lib/clubs/roles";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { entriesOpen, refundOnWithdrawal } from "@/lib/payments/fees";
import { refundPayment } from "@/lib/payments/server/checkout";
import { entryChangeSchema, entryIdSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; entryId: string }> };

/** 401 signed out, 404 no such contest, live entry or membership, 403 not the club's officer, 422 no team or class given (or too long). */
export const PATCH = route(async (request: Request, context: Context) => {
  await requireUser();
  const body = await parseJson(request, entryChangeSchema);
  const params = entryIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "officer");
  if (!(await changeEntry(db, { ...params.data, ...body }))) throw new NotFoundError("No such entry.");
  return Response.json({ changed: true }, { headers: { "cache-control": "no-store" } });
});

/**
 * 401 signed out, 404 no such contest, entry or membership, 403 a member withdrawing someone else's entry,
 * 409 a pilot after entries closed or the draw was locked (the officer decides then), 502 the refund failed (nothing withdrawn: try again).
 */
export const DELETE = route(async (_request: Request, context: Context) => {
  await requireUser();
  const params = entryIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  const me = await requireContestRole(params.data.contestId, "member");
  const officer = me.role === "admin" || hasClubRole(me.clubRole, "officer");
  const found = await entryOfContest(db, params.data);
  if (!found || found.entry.withdrawnAt) throw new NotFoundError("No such entry.");
  const now = new Date();
  if (!officer) {
    if (found.entry.pilotUserId !== me.id) throw new ForbiddenError();
    if (!entriesOpen(found.contest, now) || found.contest.drawLockedAt) throw new ConflictError("entries_closed", "Entries are closed: ask the contest's officer to withdraw you.");
  }
  const refund = refundOnWithdrawal(found.entry, found.contest, now);
  // refund first: when it fails nothing is withdrawn and the withdrawal is tried again (the refund's idempotency key prevents a second one)
  if (refund) await refundPayment({ paymentRef: found.entry.paymentRef!, entryId: found.entry.id });
  if (!(await withdrawWithRefund(db, { ...params.data, refunded: refund }))) throw new NotFoundError("No such entry.");
  return Response.json({ withdrawn: true, refunded: refund }, { headers: { "cache-control": "no-store" } });
});
