// GET /api/pilots/[pilotId]/season — the pilot's season within the filters: every chart's series, personal bests, this month against last
import { db } from "@/db";
import { getSeasonSummary } from "@/db/queries/season/summary";
import { route } from "@/lib/api";
import { seasonFiltersSchema } from "@/lib/validations/season";
import { NO_STORE, readSeasonRequest, type SeasonContext } from "./season-request";

export const dynamic = "force-dynamic";

export const GET = route(async (request: Request, context: SeasonContext) => {
  const { pilotId, query } = await readSeasonRequest(request, context, seasonFiltersSchema);
  const summary = await getSeasonSummary(db, { pilotId, filters: query, now: new Date() });
  return Response.json(summary, { headers: NO_STORE });
});
