import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { POST as presign } from "@/app/api/runs/[runId]/logs/route";
import { POST as complete } from "@/app/api/logs/[logId]/complete/route";
import { GET as getModelRoute } from "@/app/api/models/[modelId]/route";
import { createModel } from "@/db/queries/models";
import { getSeasonSummary } from "@/db/queries/season/summary";
import { seasonFiltersSchema } from "@/lib/validations/season";
import { db, freshUser, getPool } from "./support/db";
import { pushingAs, recorder, T0 } from "./sync-fixtures";
import { zoomLogCsv } from "../support/zoom-log";

/**
 * A log matched against a run as a phone pushes it (the server derives the lane's flights from the
 * events), not against flights written into the database by hand: the derived flights time their
 * launches from the working-time signal, the log and the model choices are on the corrected wall
 * clock. The phone's clock runs 7 s behind the server's (its estimate says so, to a fraction of a ms).
 */
const HEIGHTS = [46, 63];
const mapping = { hasHeader: true, timeColumn: 1, timeKind: "seconds" as const, utcOffsetMin: 0, valueColumn: 2, valueKind: "m" as const };
const json = (body: unknown) => new Request("http://test/api", { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } });

afterAll(async () => {
  await getPool().end();
});

describe("a pushed run's launches are matched to the uploaded log", () => {
  it("matches both launches on corrected time and credits the lane's model", async () => {
    const pilot = await freshUser("logs-pushed");
    const modelId = (await createModel(db, { ownerId: pilot.id, input: { name: "Pushed glider", spanMm: 1490, massG: 250, marking: "", notes: "", status: "flying" } })).id;
    const { run: r, send } = pushingAs(pilot);
    // the estimate has a fraction of a millisecond, as a real clock filter gives: corrected instants are not whole
    const phone = recorder(`pushed-${r.id}`, { thetaMs: 7000, estimate: { thetaMs: 7000.272, deltaMs: 20, measuredAtWallMs: T0 - 60_000 } });
    const flights = [{ launch: T0 + 20_000, land: T0 + 30_000 }, { launch: T0 + 33_000, land: T0 + 43_000 }];
    const events = [
      phone.at(r.id, T0, { kind: "window-start" }),
      phone.at(r.id, T0 + 5000, { kind: "model", lane: 0, modelId }),
      ...flights.flatMap((f) => [phone.at(r.id, f.launch, { kind: "launch", lane: 0 }), phone.at(r.id, f.land, { kind: "landing", lane: 0 })]),
      phone.at(r.id, T0 + 60_000, { kind: "run-end" }),
    ];
    const pushed = await send(events, { deviceId: phone.id });
    expect(pushed.body.acks.every((a) => a.status === "applied")).toBe(true);

    const startAtMs = T0 - 5000; // the time the pilot types in as "Log started at"
    const csv = zoomLogCsv(startAtMs, flights, HEIGHTS);
    const ask = await presign(json({ lane: 0, fileName: "evening.csv", sizeBytes: Buffer.byteLength(csv), contentType: "text/csv", loggerName: "Pocket", mapping, startAtMs }), { params: Promise.resolve({ runId: r.id }) });
    expect(ask.status).toBe(201);
    const { logId, url } = (await ask.json()) as { logId: string; url: string };
    expect((await fetch(url, { method: "PUT", body: csv, headers: { "content-type": "text/csv" } })).status).toBe(200);
    const res = await complete(json({ loggerName: "Pocket", mapping, startAtMs }), { params: Promise.resolve({ logId }) });
    expect(res.status).toBe(200);
    const body = (await res.json()) as { launches: { flightIndex: number | null; heightM: number; modelId: string | null; gapMs: number | null }[] };
    expect(body.launches.map((l) => l.flightIndex)).toEqual([0, 1]);
    body.launches.forEach((l, i) => expect(Math.abs(l.heightM - HEIGHTS[i]!)).toBeLessThanOrEqual(1.5));
    expect(body.launches.map((l) => l.modelId)).toEqual([modelId, modelId]);
    for (const l of body.launches) expect(Math.abs(l.gapMs!)).toBeLessThanOrEqual(500);

    const model = (await (await getModelRoute(new Request("http://test"), { params: Promise.resolve({ modelId }) })).json()) as { stats: { flights: number; launches: number; bestLaunchM: number } };
    expect(model.stats).toMatchObject({ flights: 2, launches: 2 });
    expect(Math.abs(model.stats.bestLaunchM - 63)).toBeLessThanOrEqual(1.5);
    // the Season (filtered to the model) counts the same two launches and the same best as the model's page
    const season = await getSeasonSummary(db, { pilotId: pilot.id, filters: seasonFiltersSchema.parse({ model: modelId }), now: new Date() });
    expect(season.heights.launches).toBe(2);
    expect(season.heightByWeek.map((w) => w.bestM)).toEqual([model.stats.bestLaunchM]);
  });
});
