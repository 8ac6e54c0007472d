import "./support/session";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Papa from "papaparse";
import { GET as summaryRoute } from "@/app/api/pilots/[pilotId]/season/route";
import { GET as runsRoute } from "@/app/api/pilots/[pilotId]/season/runs/route";
import { GET as flightsRoute } from "@/app/api/pilots/[pilotId]/season/flights/route";
import { GET as exportRoute } from "@/app/api/pilots/[pilotId]/season/export/route";
import type { SeasonFlightRow, SeasonPage, SeasonRunRow, SeasonSummary } from "@/lib/season/types";
import { FLIGHT_COLUMNS, RUN_COLUMNS } from "@/lib/season/csv";
import { actAs, type MockSessionUser } from "./support/session";
import { freshUser, getPool } from "./support/db";
import { LADDER, seasonRun } from "./support/season-records";

type Handler = (request: Request, context: { params: Promise<{ pilotId: string }> }) => Promise<Response>;
let pilot: MockSessionUser;
let stranger: MockSessionUser;

const call = (handler: Handler, pilotId: string, query = "") =>
  handler(new Request(`http://test/api/pilots/${pilotId}/season${query}`), { params: Promise.resolve({ pilotId }) });
const json = async <T>(res: Response): Promise<T> => {
  expect(res.status).toBe(200);
  return (await res.json()) as T;
};

beforeAll(async () => {
  pilot = await freshUser("season-routes");
  stranger = await freshUser("season-stranger");
  // twelve runs, one a day from 1 July, alternating fields; every third one a ladder
  for (let d = 1; d <= 12; d++) {
    const at = `2026-07-${String(d).padStart(2, "0")}T09:00:00Z`;
    const flights: [number, number][] = [[5, 20 + d], [25 + d, 70 + d]];
    await seasonRun({ pilotId: pilot.id, at, flights, field: d % 2 ? "North Strip" : "South Strip", task: d % 3 === 0 ? LADDER : undefined });
  }
});

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

describe("season routes", () => {
  it("answer 401 signed out, 404 for another pilot's or a made-up season, 422 for a filter they cannot read", async () => {
    for (const handler of [summaryRoute, runsRoute, flightsRoute, exportRoute] as Handler[]) {
      actAs(null);
      expect((await call(handler, pilot.id, "?what=runs")).status).toBe(401);
      actAs(stranger);
      expect((await call(handler, pilot.id, "?what=runs")).status).toBe(404);
      expect((await call(handler, "not-a-uuid", "?what=runs")).status).toBe(404);
      actAs(pilot);
      expect((await call(handler, pilot.id, "?what=runs&from=2026-02-30")).status).toBe(422);
      // days the database cannot hold as an instant (the query failed: a 500)
      expect((await call(handler, pilot.id, "?what=runs&from=0000-01-01")).status).toBe(422);
      expect((await call(handler, pilot.id, "?what=runs&to=9999-12-31")).status).toBe(422);
      expect((await call(handler, pilot.id, "?what=runs&kind=sometimes")).status).toBe(422);
    }
  });

  it("the summary follows the filters", async () => {
    actAs(pilot);
    expect((await json<SeasonSummary>(await call(summaryRoute, pilot.id))).totals).toEqual({ runs: 12, flights: 24 });
    const north = await json<SeasonSummary>(await call(summaryRoute, pilot.id, "?field=North+Strip&from=2026-07-01&to=2026-07-06"));
    expect(north.totals).toEqual({ runs: 3, flights: 6 }); // 1, 3 and 5 July
    expect((await json<SeasonSummary>(await call(summaryRoute, pilot.id, "?kind=contest"))).totals.runs).toBe(0);
    expect((await json<SeasonSummary>(await call(summaryRoute, pilot.id, "?kind=practice"))).totals.runs).toBe(12);
  });

  it("pages and sorts the runs on the server", async () => {
    actAs(pilot);
    const first = await json<SeasonPage<SeasonRunRow>>(await call(runsRoute, pilot.id, "/runs?size=10"));
    const second = await json<SeasonPage<SeasonRunRow>>(await call(runsRoute, pilot.id, "/runs?size=10&page=2"));
    expect([first.total, first.rows.length, second.rows.length]).toEqual([12, 10, 2]);
    expect(new Set([...first.rows, ...second.rows].map((r) => r.runId)).size).toBe(12);
    expect(first.rows[0]!.at).toBe("2026-07-12T09:00:00.000Z"); // newest first by default
    const byResult = await json<SeasonPage<SeasonRunRow>>(await call(runsRoute, pilot.id, "/runs?sort=result&dir=asc&size=100"));
    const results = byResult.rows.map((r) => r.resultTenths);
    expect(results).toEqual([...results].sort((a, b) => a - b));
    const ladders = await json<SeasonPage<SeasonRunRow>>(await call(runsRoute, pilot.id, "/runs?task=custom&from=2026-07-03&to=2026-07-03"));
    expect(ladders.rows.map((r) => [r.at.slice(0, 10), r.maxTenths])).toEqual([["2026-07-03", 900]]);
  });

  it("pages and sorts the flights, with the ground time before each", async () => {
    actAs(pilot);
    const page = await json<SeasonPage<SeasonFlightRow>>(await call(flightsRoute, pilot.id, "/flights?sort=turnaround&dir=asc&size=25"));
    expect(page.total).toBe(24);
    // day d: landing at 20+d s, relaunch at 25+d s → 5.0 s on the ground; first flights have none (sorted last)
    expect(page.rows.slice(0, 12).every((f) => f.turnaroundTenths === 50)).toBe(true);
    expect(page.rows.slice(12).every((f) => f.turnaroundTenths === null && f.flight === 1)).toBe(true);
  });

  it("exports runs and flights as CSV: a header row, seconds with one decimal, ISO dates with an offset", async () => {
    actAs(pilot);
    const runsCsv = await call(exportRoute, pilot.id, "/export?what=runs&from=2026-07-02&to=2026-07-02");
    expect(runsCsv.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(runsCsv.headers.get("content-disposition")).toMatch(/attachment; filename="windowcall-runs-/);
    const runs = Papa.parse<string[]>(await runsCsv.text(), { skipEmptyLines: true }).data;
    expect(runs[0]).toEqual([...RUN_COLUMNS]);
    // 2 July: flights 5→22 (17.0 s) and 27→72 (45.0 s) of a best-three task capped at 60 s
    expect(runs.slice(1)).toEqual([[expect.any(String), "0", "2026-07-02T09:00:00.000+00:00", "South Strip", "custom", "62.0", "180.0", "0.3444", "2", "118.0", "0", "practice"]]);
    const flights = Papa.parse<string[]>(await (await call(exportRoute, pilot.id, "/export?what=flights&from=2026-07-02&to=2026-07-02")).text(), { skipEmptyLines: true }).data;
    expect(flights[0]).toEqual([...FLIGHT_COLUMNS]);
    expect(flights.slice(1).map((f) => f.slice(5))).toEqual([
      ["1", "5.0", "22.0", "17.0", "17.0", "", "counted", ""],
      ["2", "27.0", "72.0", "45.0", "45.0", "", "counted", "5.0"],
    ]);
  });
});
