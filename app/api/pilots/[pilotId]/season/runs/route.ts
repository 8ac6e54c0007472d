// GET /api/pilots/[pilotId]/season/runs — one sorted page of the pilot's counted runs within the filters
import { db } from "@/db";
import { listSeasonRuns } from "@/db/queries/season/tables";
import { route } from "@/lib/api";
import { seasonRunsQuerySchema } from "@/lib/validations/season";
import { NO_STORE, readSeasonRequest, type SeasonContext } from "../season-request";

export const dynamic = "force-dynamic";

export const GET = route(async (request: Request, context: SeasonContext) => {
  const { pilotId, query } = await readSeasonRequest(request, context, seasonRunsQuerySchema);
  const { page, size, sort, dir, ...filters } = query;
  return Response.json(await listSeasonRuns(db, { pilotId, filters, paging: { page, size, sort, dir } }), { headers: NO_STORE });
});
