import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { listModelLanes } from "@/db/queries/model-record";
import { createModel } from "@/db/queries/models";
import { getSeasonSummary } from "@/db/queries/season/summary";
import { listSeasonFlights } from "@/db/queries/season/tables";
import { altimeterLogs, events, launchHeights, runs } from "@/db/schema";
import { modelStats } from "@/lib/hangar/stats";
import { seasonFiltersSchema } from "@/lib/validations/season";
import { db, freshUser, getPool } from "./support/db";
import { seasonRun } from "./support/season-records";

/**
 * The Season's launch-height charts against numbers worked out by hand. The pilot's season
 * (custom "best three of a minute" windows, flight times from seasonRun's instants):
 * - Tue 2 June (week of Mon 1 June), flown with Heron: flights 55.0, 67.6, 45.0 s; the log
 *   matched launches of 40.0, 52.0 and 31.0 m (and one launch it could not match: 70.0 m);
 * - Tue 9 June (week of Mon 8 June), Plover first, Heron from 0:41 (a swap between flights):
 *   flights 30.0 s (Plover, 20.0 m) and 57.0 s (Heron, 45.0 m); an older log of the same lane
 *   had matched the first flight at 99.0 m — the newer log counts;
 * - a run someone else recorded for the pilot, not accepted, with a 80.0 m launch: never counted.
 */
const NOW = new Date("2026-06-20T12:00:00Z");
let pilotId: string;
let heron: string;
let plover: string;

async function modelEvent(runId: string, atS: number, modelId: string) {
  const [run] = await db.select({ at: runs.createdAt, by: runs.createdBy }).from(runs).where(eq(runs.id, runId));
  const ms = run!.at.getTime() + atS * 1000;
  await db.insert(events).values({
    id: uuidv7({ msecs: ms }), runId, deviceId: `season-model-${runId}`, seq: atS, recordedBy: run!.by, kind: "model",
    body: { kind: "model", lane: 0, modelId }, wallMs: ms, monoMs: 1000, pageId: `season-model-${runId}`, correctedMs: ms,
  });
}

/** A parsed log of lane 0 with these launches ([flight index or null, metres, model]); `ageS` makes it older. */
async function logWith(ownerId: string, runId: string, launches: [number | null, number, string][], ageS = 0) {
  const [log] = await db.insert(altimeterLogs).values({
    ownerId, runId, lane: 0, objectKey: `logs/${runId}/${randomBytes(16).toString("base64url")}.csv`, fileName: "season.csv",
    loggerName: "Season logger", sizeBytes: 100, status: "parsed", samples: 100, createdAt: new Date(Date.now() - ageS * 1000),
  }).returning();
  await db.insert(launchHeights).values(launches.map(([flightIndex, heightM, modelId], i) => ({
    logId: log!.id, runId, lane: 0, atMs: Date.now() + i, heightM, flightIndex, gapMs: flightIndex === null ? null : 300, modelId,
  })));
}

beforeAll(async () => {
  const pilot = await freshUser("season-heights");
  const keeper = await freshUser("season-heights-keeper");
  pilotId = pilot.id;
  const model = (name: string) => createModel(db, { ownerId: pilotId, input: { name, spanMm: 1490, massG: 250, marking: "", notes: "", status: "flying" } });
  heron = (await model("Heights Heron")).id;
  plover = (await model("Heights Plover")).id;
  const june2 = await seasonRun({ pilotId, at: "2026-06-02T10:00:00Z", flights: [[5, 60], [62.4, 130], [135, 180]] });
  await modelEvent(june2, 1, heron);
  await logWith(pilotId, june2, [[0, 40, heron], [1, 52, heron], [2, 31, heron], [null, 70, heron]]);
  const june9 = await seasonRun({ pilotId, at: "2026-06-09T10:00:00Z", flights: [[10, 40], [43, 100]] });
  await modelEvent(june9, 1, plover);
  await modelEvent(june9, 41, heron);
  await logWith(pilotId, june9, [[0, 99, plover]], 3600);
  await logWith(pilotId, june9, [[0, 20, plover], [1, 45, heron]]);
  const notMine = await seasonRun({ pilotId, at: "2026-06-10T10:00:00Z", flights: [[1, 30]], recordedBy: keeper.id });
  await logWith(keeper.id, notMine, [[0, 80, heron]]);
});

afterAll(async () => {
  await getPool().end();
});

const season = (filters: Record<string, string> = {}) => getSeasonSummary(db, { pilotId, filters: seasonFiltersSchema.parse(filters), now: NOW });

describe("season launch heights (hand-computed)", () => {
  it("counts the matched launches of counted flights, the newer log's height, none unmatched or unaccepted", async () => {
    const s = await season();
    // 40, 52, 31, 20, 45 → median 40
    expect(s.heights.launches).toBe(5);
    expect(s.heights.medianM).toBe(40);
    expect(s.heightByWeek).toEqual([
      { week: "2026-06-01", launches: 3, medianM: 40, bestM: 52 },
      { week: "2026-06-08", launches: 2, medianM: 32.5, bestM: 45 },
    ]);
  });

  it("height against flight time: median flight time per 10 m of launch height, and the slope", async () => {
    const s = await season();
    expect(s.heightVsTime).toEqual([
      { fromM: 20, toM: 30, flights: 1, medianTenths: 300 },
      { fromM: 30, toM: 40, flights: 1, medianTenths: 450 },
      { fromM: 40, toM: 50, flights: 2, medianTenths: 560 }, // 55.0 and 57.0 s
      { fromM: 50, toM: 60, flights: 1, medianTenths: 676 },
    ]);
    // least squares of time on height: x̄ 37.6, ȳ 50.92, Sxy 702.24, Sxx 621.2 → 1.1305 s per metre
    expect(s.heights.secondsPerTenMetres).toBe(11.3);
  });

  it("the model filter keeps the lanes flown with the model and the launches made with it", async () => {
    const withHeron = await season({ model: heron });
    // June 2: three Heron flights; June 9: the second flight only (the first was Plover's)
    expect(withHeron.totals).toEqual({ runs: 2, flights: 4 });
    // 40, 52, 31, 45 → median 42.5; x̄ 42, ȳ 56.15, Sxy 242, Sxx 234 → 1.0342 s per metre
    expect(withHeron.heights).toEqual({ launches: 4, medianM: 42.5, secondsPerTenMetres: 10.3 });
    expect(withHeron.heightByWeek).toEqual([
      { week: "2026-06-01", launches: 3, medianM: 40, bestM: 52 },
      { week: "2026-06-08", launches: 1, medianM: 45, bestM: 45 },
    ]);
    const withPlover = await season({ model: plover });
    expect(withPlover.totals).toEqual({ runs: 1, flights: 1 });
    expect(withPlover.heights).toEqual({ launches: 1, medianM: 20, secondsPerTenMetres: null });
    expect((await season({ model: "0190aaaa-0000-7000-8000-000000000000" })).totals.runs).toBe(0);
  });

  it("a model's flights, windows, turnaround and heights are the same on the Season as on its model page (flights by the model flying at launch)", async () => {
    const withHeron = await season({ model: heron });
    // Heron's ground times: June 2, 62.4 − 60 = 2.4 s and 135 − 130 = 5.0 s (median 3.7 s); June 9's 3.0 s
    // follows a Plover landing, so it is nobody's turnaround for Heron
    expect(withHeron.turnaroundByWeek).toEqual([{ week: "2026-06-01", count: 2, medianTenths: 37, p90Tenths: 47 }]);
    expect(withHeron.months.this).toMatchObject({ flights: 4, turnaroundTenths: 37 });
    const flightsTable = await listSeasonFlights(db, { pilotId, filters: seasonFiltersSchema.parse({ model: heron }), paging: "all" });
    expect(flightsTable.rows.map((r) => r.durationTenths).sort()).toEqual([450, 550, 570, 676]);
    for (const [model, s] of [[heron, withHeron], [plover, await season({ model: plover })]] as const) {
      const page = modelStats(model, await listModelLanes(db, { modelId: model, ownerIds: [pilotId] }));
      expect(s.totals.flights).toBe(page.flights);
      expect(s.heights.launches).toBe(page.launches);
      expect(s.heights.medianM).toBe(page.medianLaunchM);
      expect(s.months.this.turnaroundTenths).toBe(page.medianTurnaroundMs === null ? null : Math.round(page.medianTurnaroundMs / 100));
    }
    expect((await season({ model: plover })).turnaroundByWeek).toEqual([]);
  });

  it("other filters apply to the heights too, and the hangar is listed for the filter", async () => {
    const week2 = await season({ from: "2026-06-08" });
    expect(week2.heights).toMatchObject({ launches: 2, medianM: 32.5 });
    expect((await season({ kind: "contest" })).heights).toEqual({ launches: 0, medianM: null, secondsPerTenMetres: null });
    expect((await season()).models.map((m) => m.name)).toEqual(["Heights Heron", "Heights Plover"]);
  });

  it("the filter refuses what is not a model id", () => {
    expect(seasonFiltersSchema.safeParse({ model: "heron" }).success).toBe(false);
  });

  it("the model's page counts the same launch height per flight as the Season: the newer log's, whatever order the rows were stored in", async () => {
    const owner = await freshUser("season-heights-one-truth");
    const kite = (await createModel(db, { ownerId: owner.id, input: { name: "Truth Kite", spanMm: 1490, massG: 250, marking: "", notes: "", status: "flying" } })).id;
    const run = await seasonRun({ pilotId: owner.id, at: "2026-06-03T10:00:00Z", flights: [[10, 70]] });
    await modelEvent(run, 1, kite);
    await logWith(owner.id, run, [[0, 38, kite]]); // the newer log, stored first
    await logWith(owner.id, run, [[0, 91, kite]], 3600); // an older log of the same lane, stored after it
    const onSeason = await getSeasonSummary(db, { pilotId: owner.id, filters: seasonFiltersSchema.parse({ model: kite }), now: NOW });
    expect(onSeason.heights).toMatchObject({ launches: 1, medianM: 38 });
    const onModelPage = modelStats(kite, await listModelLanes(db, { modelId: kite, ownerIds: [owner.id] }));
    expect(onModelPage.medianLaunchM).toBe(38);
    expect(onModelPage.bestLaunchM).toBe(38);
  });
});
