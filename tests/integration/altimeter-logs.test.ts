import "./support/session";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { POST as presign, GET as listLogs } from "@/app/api/runs/[runId]/logs/route";
import { POST as complete } from "@/app/api/logs/[logId]/complete/route";
import { GET as download } from "@/app/api/logs/[logId]/download/route";
import { GET as getModelRoute } from "@/app/api/models/[modelId]/route";
import { DELETE as deleteAccountRoute } from "@/app/api/account/route";
import { hashPassword } from "@/lib/auth/password";
import { models } from "@/db/schema";
import { createModel } from "@/db/queries/models";
import { getSeasonSummary } from "@/db/queries/season/summary";
import { seasonFiltersSchema } from "@/lib/validations/season";
import { exportAccount } from "@/db/queries/account-export";
import { altimeterLogs, launchHeights } from "@/db/schema";
import { generateTrace } from "../unit/altimeter/trace";
import { actAs } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { insertRun, insertSession } from "./support/records";
import { chooseModel, setLaneFlights, storedKeys } from "./support/altimeter";

type User = Awaited<ReturnType<typeof freshUser>>;
const CLOCK_GAP_MS = 42_000; // the logger's clock is 42 s behind the run's
const mapping = { hasHeader: true, timeColumn: 1, timeKind: "seconds" as const, utcOffsetMin: 0, valueColumn: 2, valueKind: "m" as const };
const json = (body: unknown) => new Request("http://test/api", { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } });
const runParams = (runId: string) => ({ params: Promise.resolve({ runId }) });
const logParams = (logId: string) => ({ params: Promise.resolve({ logId }) });

let pilot: User, other: User, runId: string, modelId: string, csv: string, startAtMs: number, launchAt: number[];

beforeAll(async () => {
  pilot = await freshUser("logs-pilot");
  other = await freshUser("logs-other");
  runId = await insertRun(await insertSession(pilot.id), pilot.id, [{ pilotUserId: pilot.id, pilotName: pilot.name }]);
  modelId = (await createModel(db, { ownerId: pilot.id, input: { name: "Test glider", spanMm: 1490, massG: 250, marking: "red tips", notes: "", status: "flying" } })).id;
  const trace = generateTrace({ seed: 99, hz: 10, noiseM: 0.1, launches: 5, groundM: 200 });
  startAtMs = trace.samples[0]!.tMs;
  csv = `seconds,altitude\n${trace.samples.map((s) => `${((s.tMs - startAtMs) / 1000).toFixed(2)},${s.hM}`).join("\n")}\n`;
  launchAt = trace.launches.map((l) => l.atMs + CLOCK_GAP_MS);
  await setLaneFlights(runId, 0, launchAt.slice(0, 4)); // the fifth launch was never timed
  await chooseModel(runId, 0, modelId, launchAt[0]! - 60_000, pilot.id);
});

afterAll(async () => {
  await getPool().end();
});

async function upload(body: string, overrides: Record<string, unknown> = {}, putType = "text/csv") {
  const res = await presign(json({ lane: 0, fileName: "flight.csv", sizeBytes: Buffer.byteLength(body), contentType: "text/csv", loggerName: "Test logger", mapping, startAtMs, ...overrides }), runParams(runId));
  expect(res.status).toBe(201);
  const { logId, url } = (await res.json()) as { logId: string; url: string };
  const put = await fetch(url, { method: "PUT", body, headers: { "content-type": putType } });
  return { logId, put };
}

describe("altimeter logs through the SDK and the local object server", () => {
  it("uploads, parses, matches and stores launch heights; unmatched launches are listed", async () => {
    actAs(pilot);
    const { logId, put } = await upload(csv);
    expect(put.status).toBe(200);
    const res = await complete(json({ loggerName: "Test logger", mapping, startAtMs }), logParams(logId));
    expect(res.status).toBe(200);
    const body = (await res.json()) as { offsetMs: number; launches: { flightIndex: number | null; gapMs: number | null; heightM: number; modelId: string | null }[] };
    expect(Math.abs(body.offsetMs - CLOCK_GAP_MS)).toBeLessThanOrEqual(500);
    expect(body.launches.map((l) => l.flightIndex)).toEqual([0, 1, 2, 3, null]);
    for (const l of body.launches.slice(0, 4)) expect(Math.abs(l.gapMs! + CLOCK_GAP_MS)).toBeLessThanOrEqual(500);
    expect(body.launches[0]!.modelId).toBe(modelId);
    const stored = await db.select().from(launchHeights).where(eq(launchHeights.logId, logId));
    expect(stored).toHaveLength(5);
    const listed = (await (await listLogs(new Request("http://test"), runParams(runId))).json()) as { logs: { launches: unknown[] }[] };
    expect(listed.logs[0]!.launches).toHaveLength(5);
    const model = (await (await getModelRoute(new Request("http://test"), { params: Promise.resolve({ modelId }) })).json()) as { stats: { flights: number; launches: number; bestLaunchM: number } };
    expect(model.stats).toMatchObject({ flights: 4, launches: 4 });
    const exported = (await exportAccount(db, pilot.id))!.hangar;
    expect(exported.models.map((m) => m.name)).toEqual(["Test glider"]);
    expect(exported.altimeterLogs[0]!.launches).toHaveLength(5);
    expect(JSON.stringify(exported)).not.toContain("logs/"); // no storage keys in the export
    // the Season counts the four matched launches (flights of 60.0 s), with the model; the other pilot's season none
    const season = (pilotId: string, filters = {}) => getSeasonSummary(db, { pilotId, filters: seasonFiltersSchema.parse(filters), now: new Date() });
    expect((await season(pilot.id, { model: modelId })).heights.launches).toBe(4);
    const bins = (await season(pilot.id)).heightVsTime;
    expect(bins.reduce((n, b) => n + b.flights, 0)).toBe(4);
    for (const b of bins) expect(b.medianTenths).toBe(600);
    expect((await season(other.id)).heights.launches).toBe(0);
    const link = (await (await download(new Request("http://test"), logParams(logId))).json()) as { url: string };
    expect(await (await fetch(link.url)).text()).toBe(csv);
  });

  it("another pilot gets 404 for the run's logs, an upload URL, the log and its download", async () => {
    actAs(other);
    expect((await listLogs(new Request("http://test"), runParams(runId))).status).toBe(404);
    const ask = await presign(json({ lane: 0, fileName: "x.csv", sizeBytes: 10, contentType: "text/csv", loggerName: "x", mapping, startAtMs }), runParams(runId));
    expect(ask.status).toBe(404);
    const [log] = await db.select().from(altimeterLogs).where(eq(altimeterLogs.runId, runId));
    expect((await complete(json({ loggerName: "x", mapping, startAtMs }), logParams(log!.id))).status).toBe(404);
    expect((await download(new Request("http://test"), logParams(log!.id))).status).toBe(404);
  });

  it("a malformed file is refused naming line and column, and nothing of it is kept", async () => {
    actAs(pilot);
    const before = await storedKeys(`logs/${runId}/`);
    const bad = csv.split("\n").map((line, i) => (i === 6 ? "0.5,abc" : line)).join("\n");
    const { logId } = await upload(bad);
    const res = await complete(json({ loggerName: "Test logger", mapping, startAtMs }), logParams(logId));
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { message: string } }).error.message).toBe('Line 7, column 2 (height): "abc" is not a number.');
    expect(await storedKeys(`logs/${runId}/`)).toEqual(before);
    expect(await db.select().from(altimeterLogs).where(eq(altimeterLogs.id, logId))).toEqual([]);
  });

  it("an oversized file is refused before upload (declared) and after it (a client that lied); nothing is kept", async () => {
    actAs(pilot);
    const before = await storedKeys(`logs/${runId}/`);
    const ask = await presign(json({ lane: 0, fileName: "big.csv", sizeBytes: 5 * 1024 * 1024 + 1, contentType: "text/csv", loggerName: "x", mapping, startAtMs }), runParams(runId));
    expect(ask.status).toBe(413);
    const big = `t,h\n${"0,1\n".repeat(1_400_000)}`; // 5.6 MB
    const { logId } = await upload(big, { sizeBytes: 1000 });
    const res = await complete(json({ loggerName: "x", mapping, startAtMs }), logParams(logId));
    expect(res.status).toBe(413);
    expect(await storedKeys(`logs/${runId}/`)).toEqual(before);
    expect(await db.select().from(altimeterLogs).where(eq(altimeterLogs.id, logId))).toEqual([]);
  });

  it("a wrong content type is refused when asked for and when the PUT sends another; nothing is kept", async () => {
    actAs(pilot);
    const before = await storedKeys(`logs/${runId}/`);
    const ask = await presign(json({ lane: 0, fileName: "log.pdf", sizeBytes: 100, contentType: "application/pdf", loggerName: "x", mapping, startAtMs }), runParams(runId));
    expect(ask.status).toBe(415);
    const { logId, put } = await upload(csv, {}, "application/octet-stream");
    const res = await complete(json({ loggerName: "x", mapping, startAtMs }), logParams(logId));
    expect([409, 415]).toContain(res.status); // refused by the signature (never stored) or by the check after it
    if (put.ok) expect(res.status).toBe(415);
    expect(await storedKeys(`logs/${runId}/`)).toEqual(before);
    if (res.status === 415) expect(await db.select().from(altimeterLogs).where(eq(altimeterLogs.id, logId))).toEqual([]);
  });

  it("deleting the account deletes its models, logs and the log files", async () => {
    const leaving = await freshUser("logs-leaving", { passwordHash: await hashPassword("leaving-window-2026") });
    actAs(leaving);
    const ownRun = await insertRun(await insertSession(leaving.id), leaving.id, [{ pilotUserId: leaving.id, pilotName: leaving.name }]);
    await createModel(db, { ownerId: leaving.id, input: { name: "Leaving glider", spanMm: 1400, massG: 230, marking: "", notes: "", status: "flying" } });
    const ask = await presign(json({ lane: 0, fileName: "f.csv", sizeBytes: Buffer.byteLength(csv), contentType: "text/csv", loggerName: "L", mapping, startAtMs }), runParams(ownRun));
    const { logId, url } = (await ask.json()) as { logId: string; url: string };
    await fetch(url, { method: "PUT", body: csv, headers: { "content-type": "text/csv" } });
    expect((await complete(json({ loggerName: "L", mapping, startAtMs }), logParams(logId))).status).toBe(200);
    expect(await storedKeys(`logs/${ownRun}/`)).toHaveLength(1);
    const res = await deleteAccountRoute(new Request("http://test/api/account", { method: "DELETE", body: JSON.stringify({ password: "leaving-window-2026" }), headers: { "content-type": "application/json" } }));
    expect(res.status).toBe(200);
    expect(await storedKeys(`logs/${ownRun}/`)).toEqual([]);
    expect(await db.select().from(models).where(eq(models.ownerId, leaving.id))).toEqual([]);
    expect(await db.select().from(altimeterLogs).where(eq(altimeterLogs.ownerId, leaving.id))).toEqual([]);
  });
});
