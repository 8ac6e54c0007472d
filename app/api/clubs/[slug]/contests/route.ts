// POST /api/clubs/[slug]/contests — an officer creates a contest: date, field, rounds with their tasks, groups, times, drop rule
import { db } from "@/db";
import { createContest } from "@/db/queries/contests";
import { parseJson, route } from "@/lib/api";
import { requireClubRole } from "@/lib/auth/session";
import { checkSetup } from "@/lib/contests/setup";
import { ValidationError } from "@/lib/errors";
import { clubRef } from "@/lib/validations/clubs";
import { createContestSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ slug: string }> };

/** 401 signed out, 404 not a member, 403 not an officer, 422 a rule broken (a practice event only warns). */
export const POST = route(async (request: Request, context: Context) => {
  const me = await requireClubRole(clubRef(await context.params), "officer");
  const input = await parseJson(request, createContestSchema);
  const check = checkSetup({ ...input, rounds: [...input.rounds, ...input.flyOffRounds.map((r) => ({ ...r, flyOff: true }))] });
  if (check.errors.length > 0) throw new ValidationError(check.errors.join(" "));
  const contest = await createContest(db, { clubId: me.clubId, userId: me.id, input });
  return Response.json({ contest: { id: contest.id }, warnings: check.warnings }, { status: 201, headers: { "cache-control": "no-store" } });
});
