// POST /api/contests/[contestId]/paper-entries — an officer adds an entry from paper (a pilot without an account)
import { db } from "@/db";
import { addPaperEntry } from "@/db/queries/contests";
import { parseJson, route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { contestIdSchema, paperEntrySchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string }> };

/** 401 signed out, 404 no such contest or not a member, 403 not an officer. */
export const POST = route(async (request: Request, context: Context) => {
  await requireUser();
  const body = await parseJson(request, paperEntrySchema);
  const params = contestIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "officer");
  const row = await addPaperEntry(db, { contestId: params.data.contestId, ...body });
  return Response.json({ entry: { id: row.id } }, { status: 201, headers: { "cache-control": "no-store" } });
});
