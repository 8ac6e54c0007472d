// GET /api/pilots/[pilotId]/season/export — download the pilot's runs or flights within the filters as CSV (README "Season exports")
import { db } from "@/db";
import { listSeasonFlights, listSeasonRuns } from "@/db/queries/season/tables";
import { route } from "@/lib/api";
import { FLIGHT_COLUMNS, RUN_COLUMNS, flightCells, runCells, toCsv } from "@/lib/season/csv";
import { seasonExportQuerySchema } from "@/lib/validations/season";
import { NO_STORE, readSeasonRequest, type SeasonContext } from "../season-request";

export const dynamic = "force-dynamic";

export const GET = route(async (request: Request, context: SeasonContext) => {
  const { pilotId, query } = await readSeasonRequest(request, context, seasonExportQuerySchema);
  const { what, ...filters } = query;
  const csv =
    what === "runs"
      ? toCsv(RUN_COLUMNS, (await listSeasonRuns(db, { pilotId, filters, paging: "all" })).rows.map(runCells))
      : toCsv(FLIGHT_COLUMNS, (await listSeasonFlights(db, { pilotId, filters, paging: "all" })).rows.map(flightCells));
  const day = new Date().toISOString().slice(0, 10);
  return new Response(csv, {
    headers: {
      ...NO_STORE,
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="windowcall-${what}-${day}.csv"`,
    },
  });
});
