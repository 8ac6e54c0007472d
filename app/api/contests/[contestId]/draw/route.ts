// POST /api/contests/[contestId]/draw — an officer makes (or re-makes, until locked) the seeded draw of every round
import { randomInt } from "node:crypto";
import { db } from "@/db";
import { hasResultsMessage, saveDraw } from "@/db/queries/contest-draw";
import { FLY_OFF_RESULTS_MESSAGE } from "@/db/queries/contest-fly-off";
import { getContest } from "@/db/queries/contests";
import { parseJson, route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { drawEntries } from "@/lib/contests/entries-draw";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { contestIdSchema, drawSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string }> };

/**
 * 401, 404, 403 as every officer route; 409 when the draw is locked, fewer than 2 pilots are entered, or the fly-off
 * has results (`fly_off_results`), and (`has_results`, nothing changed) while a preliminary slot or re-flight holds a
 * result unless the body says `replaceResults: true`. A fly-off drawn without results is cleared with the old draw
 * (`flyOffCleared`).
 */
export const POST = route(async (request: Request, context: Context) => {
  await requireUser();
  const body = await parseJson(request, drawSchema);
  const params = contestIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "officer");
  const found = await getContest(db, params.data.contestId);
  if (!found) throw new NotFoundError();
  const live = found.entries.filter((e) => !e.withdrawnAt);
  if (live.length < 2) throw new ConflictError("too_few", "Enter at least 2 pilots before the draw.");
  const seed = body.seed ?? randomInt(0, 2_147_483_647);
  const drawn = drawEntries({ entries: live, rounds: found.rounds.map((r) => r.number), maxGroupSize: found.contest.maxGroupSize, seed });
  const saved = await saveDraw(db, { contestId: params.data.contestId, seed, rounds: drawn.rounds, replaceResults: body.replaceResults });
  if (saved === "locked") throw new ConflictError("locked", "The draw is locked.");
  if (saved === "fly_off_results") throw new ConflictError("fly_off_results", FLY_OFF_RESULTS_MESSAGE);
  if ("hasResults" in saved) throw new ConflictError("has_results", hasResultsMessage(saved.hasResults));
  const { max, stdDev } = drawn.result.stats;
  return Response.json({ seed, maxMeetings: max, spread: stdDev, apartBroken: drawn.result.apartBroken, flyOffCleared: saved.flyOffCleared }, { status: 201, headers: { "cache-control": "no-store" } });
});
