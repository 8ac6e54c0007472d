// GET /api/runs/[runId]/club-days — the field days of the user's clubs this run may be put in
// PUT /api/runs/[runId]/club-days — the pilot puts the run in one of them, or takes it out
import { db } from "@/db";
import { chooseRunDay, listRunDayChoices } from "@/db/queries/club-days";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { chooseDaySchema } from "@/lib/validations/club-days";
import { pathId } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ runId: string }> };

/** 401 signed out; an empty list for a run that is not the user's (set up by them, or flown and not disputed or hidden). */
export const GET = route(async (_request: Request, context: Context) => {
  const user = await requireUser();
  const runId = pathId((await context.params).runId);
  const days = runId === null ? [] : await listRunDayChoices(db, { userId: user.id, runId });
  return Response.json({ days }, { headers: { "cache-control": "no-store" } });
});

/** 401 signed out; 404 when the run is not the user's or the day is not one of its choices; 409 the day is closed. */
export const PUT = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const input = await parseJson(request, chooseDaySchema);
  const runId = pathId((await context.params).runId);
  const chose = runId === null ? false : await chooseRunDay(db, { userId: user.id, runId, dayId: input.dayId, chosen: input.chosen });
  if (!chose) throw new NotFoundError("That run cannot go in that field day.");
  if (chose === "closed") throw new ConflictError("day_closed", "That field day is closed: its runs no longer change.");
  return Response.json({ dayId: input.dayId, chosen: input.chosen }, { headers: { "cache-control": "no-store" } });
});
