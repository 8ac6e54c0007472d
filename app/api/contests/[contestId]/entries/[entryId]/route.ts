// DELETE /api/contests/[contestId]/entries/[entryId] — an officer withdraws an entry (kept, marked withdrawn)
import { db } from "@/db";
import { withdrawEntry } from "@/db/queries/contests";
import { route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { entryIdSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; entryId: string }> };

/** 401 signed out, 404 no such contest, entry or membership, 403 not an officer. */
export const DELETE = route(async (_request: Request, context: Context) => {
  await requireUser();
  const params = entryIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "officer");
  if (!(await withdrawEntry(db, params.data))) throw new NotFoundError("No such entry.");
  return Response.json({ withdrawn: true }, { headers: { "cache-control": "no-store" } });
});
