// GET /api/pilots/[pilotId]/season — the pilot's season within the filters: every chart's series, personal bests, this month against last
import { db } from "@/db";
import { getSeasonSummaryJson } from "@/db/queries/season/summary";
import { route } from "@/lib/api";
import { seasonFiltersSchema } from "@/lib/validations/season";
import { NO_STORE, readSeasonRequest, type SeasonContext } from "./season-request";

export const dynamic = "force-dynamic";

export const GET = route(async (request: Request, context: SeasonContext) => {
  const { pilotId, query } = await readSeasonRequest(request, context, seasonFiltersSchema);
  // PostgreSQL's JSON text as it comes (one statement; nothing parsed and written again here)
  const summary = await getSeasonSummaryJson(db, { pilotId, filters: query, now: new Date() });
  return new Response(summary, { headers: { "content-type": "application/json", ...NO_STORE } });
});
