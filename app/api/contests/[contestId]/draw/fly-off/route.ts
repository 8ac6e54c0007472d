// POST /api/contests/[contestId]/draw/fly-off — an officer draws the fly-off: the top pilots of the preliminary order, one group a fly-off round
import { db } from "@/db";
import { getResultsData } from "@/db/queries/contest-results";
import { saveFlyOffDraw } from "@/db/queries/contest-fly-off";
import { parseJson, route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { drawFlyOff } from "@/lib/contests/fly-off-draw";
import { contestStandings } from "@/lib/contests/standings";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { contestIdSchema, flyOffDrawSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string }> };

/**
 * 401, 404, 403 as every officer route. 409 `no_fly_off` when none is planned, `not_ready` while a
 * preliminary round is not fully scored, `has_results` when fly-off results exist and the body does
 * not say `replaceResults: true`. 201 with the pilots drawn and those who came in on a tie at the cut-off.
 */
export const POST = route(async (request: Request, context: Context) => {
  await requireUser();
  const body = await parseJson(request, flyOffDrawSchema);
  const params = contestIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  const { contestId } = params.data;
  await requireContestRole(contestId, "officer");
  const data = await getResultsData(db, contestId);
  if (!data) throw new NotFoundError();
  if (data.contest.flyOffPilots === null || !data.input.rounds.some((r) => r.isFlyOff)) {
    throw new ConflictError("no_fly_off", "This contest has no fly-off planned.");
  }
  // the order comes from the one standings value (lib/contests/standings.ts), never computed apart
  const drawn = drawFlyOff(data.input, contestStandings(data.input), data.contest.flyOffPilots);
  if (!drawn.ok) throw new ConflictError("not_ready", drawn.problem);
  const saved = await saveFlyOffDraw(db, { contestId, entryIds: drawn.entryIds, replaceResults: body.replaceResults });
  if (saved === "no_fly_off") throw new ConflictError("no_fly_off", "This contest has no fly-off planned.");
  if (saved === "has_results") {
    throw new ConflictError("has_results", "Fly-off results are already entered: drawing again deletes them. Confirm to draw again.");
  }
  return Response.json({ pilots: drawn.names, tiedAtCutOff: drawn.tiedAtCutOff }, { status: 201, headers: { "cache-control": "no-store" } });
});
