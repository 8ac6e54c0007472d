// POST /api/contests/[contestId]/entries/[entryId]/cash — an officer marks an unpaid entry paid in cash (who and when are kept)
import { db } from "@/db";
import { entryOfContest, markCashPaid } from "@/db/queries/contest-payments";
import { route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { entryIdSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; entryId: string }> };

/** 401 signed out, 404 no such contest, live entry or membership, 403 not an officer, 409 no fee or paid already. */
export const POST = route(async (_request: Request, context: Context) => {
  await requireUser();
  const params = entryIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  const me = await requireContestRole(params.data.contestId, "officer");
  const found = await entryOfContest(db, params.data);
  if (!found || found.entry.withdrawnAt) throw new NotFoundError("No such entry.");
  if (found.contest.entryFeeCents === null) throw new ConflictError("no_fee", "This contest has no entry fee.");
  if (!(await markCashPaid(db, { ...params.data, officerId: me.id }))) throw new ConflictError("paid", "This entry is paid already.");
  return Response.json({ paymentStatus: "paid", paymentRef: "cash" }, { headers: { "cache-control": "no-store" } });
});
