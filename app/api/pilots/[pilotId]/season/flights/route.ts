// GET /api/pilots/[pilotId]/season/flights — one sorted page of the flights of the pilot's counted runs within the filters
import { db } from "@/db";
import { listSeasonFlights } from "@/db/queries/season/tables";
import { route } from "@/lib/api";
import { seasonFlightsQuerySchema } from "@/lib/validations/season";
import { NO_STORE, readSeasonRequest, type SeasonContext } from "../season-request";

export const dynamic = "force-dynamic";

export const GET = route(async (request: Request, context: SeasonContext) => {
  const { pilotId, query } = await readSeasonRequest(request, context, seasonFlightsQuerySchema);
  const { page, size, sort, dir, ...filters } = query;
  return Response.json(await listSeasonFlights(db, { pilotId, filters, paging: { page, size, sort, dir } }), { headers: NO_STORE });
});
