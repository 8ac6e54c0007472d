import { and, desc, eq, sql } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { detectLaunches } from "@/lib/altimeter/detect";
import { matchLaunches } from "@/lib/altimeter/match";
import { mulberry32 } from "@/lib/random";
import { flightInstants, type FlightInstant } from "@/lib/results/flight-instants";
import { deleteObject, newObjectKey } from "@/lib/storage/server/s3";
import { putDemoObject } from "./put-object";
import type { Database } from "../index";
import { MODEL_OFFER_TTL_MS } from "../queries/model-offers";
import { altimeterLogs, events, fieldSessions, launchHeights, loggerMappings, modelOffers, modelRepairs, models, runLanes, runs, users } from "../schema";

/** Invented models (no real designs or makers): Ada's three and Tobi's one, with a repair history. */
const ADA_MODELS = [
  { name: "Swift Heron", spanMm: 1496, massG: 248, marking: "white wing, orange tips", notes: "Contest model, best in light air", status: "flying" as const },
  { name: "Blue Tern", spanMm: 1490, massG: 272, marking: "blue fuselage, black stripe", notes: "Ballast ready for wind", status: "flying" as const },
  { name: "Old Red", spanMm: 1510, massG: 655, marking: "all red, patched tail", notes: "Trainer; heavy after repairs", status: "being-repaired" as const },
];
const DEMO_MAPPING = { hasHeader: true, timeColumn: 1, timeKind: "seconds", utcOffsetMin: 0, valueColumn: 2, valueKind: "m" } as const;

/**
 * The hangar demo: models and repairs for Ada and Tobi, Ada's latest own run flown with Swift
 * Heron and about a dozen earlier ones across the season with Heron or Blue Tern ("model" events),
 * and, when object storage is configured, an invented altimeter log of each read through the real
 * detection and matching (launch heights for the run page, the hangar and the Season charts);
 * Tobi's offer of Grey Plover to Ada, waiting for her answer.
 * Does nothing when Ada has models already.
 */
export async function seedHangar(db: Database): Promise<void> {
  const [ada] = await db.select().from(users).where(eq(users.email, "ada@example.com"));
  const [tobi] = await db.select().from(users).where(eq(users.email, "tobi@example.com"));
  if (!ada || !tobi) return;
  const [has] = await db.select({ n: sql<number>`count(*)::int` }).from(models).where(eq(models.ownerId, ada.id));
  if ((has?.n ?? 0) > 0) return;
  const mine = await db.insert(models).values(ADA_MODELS.map((m) => ({ ...m, ownerId: ada.id }))).returning();
  const [plover] = await db.insert(models).values({ ownerId: tobi.id, name: "Grey Plover", spanMm: 1480, massG: 265, marking: "grey, yellow tail" }).returning();
  // Tobi offers Grey Plover to Ada, without its history: it waits in Ada's hangar for her answer
  await db.insert(modelOffers).values({ modelId: plover!.id, sellerId: tobi.id, email: "ada@example.com", withHistory: false, expiresAt: new Date(Date.now() + MODEL_OFFER_TTL_MS) });
  const red = mine.find((m) => m.name === "Old Red")!;
  await db.insert(modelRepairs).values([
    { modelId: red.id, repairedOn: "2026-04-11", work: "Glued a cracked boom", massAfterG: 612 },
    { modelId: red.id, repairedOn: "2026-07-02", work: "New tailplane after a hard landing", massAfterG: 640 },
    { modelId: red.id, repairedOn: "2026-10-19", work: "Re-covered the wing root", massAfterG: 655 },
  ]);
  const heron = mine.find((m) => m.name === "Swift Heron")!;
  const tern = mine.find((m) => m.name === "Blue Tern")!;
  const own = await db.select({ id: runs.id, derived: runLanes.derived }).from(runs)
    .innerJoin(fieldSessions, eq(fieldSessions.id, runs.sessionId))
    .innerJoin(runLanes, and(eq(runLanes.runId, runs.id), eq(runLanes.lane, 0)))
    .where(and(eq(fieldSessions.ownerId, ada.id), eq(runs.createdBy, ada.id))).orderBy(desc(runs.createdAt));
  const recent = own.slice(0, 12);
  const latest = recent.find((r) => flightInstants(r.derived).length >= 3) ?? recent[0]; // a window with a few flights shows more
  if (!latest || flightInstants(latest.derived).length === 0) return;
  // the latest with Swift Heron, and about a dozen more windows across the season, Heron and Blue Tern in turn, for the Season charts
  const withFlights = own.filter((r) => r.id !== latest.id && flightInstants(r.derived).length >= 2);
  const step = Math.max(1, Math.floor(withFlights.length / 12));
  const spread = withFlights.filter((_, i) => i % step === 0).slice(0, 12);
  const flown = [{ run: latest, model: heron }, ...spread.map((run, i) => ({ run, model: i % 2 === 0 ? tern : heron }))];
  const choices = [];
  for (const [i, f] of flown.entries()) {
    const flights = flightInstants(f.run.derived);
    // stamped between the run's first event and its first launch (corrected clock), never before the run began
    const [first] = await db.select({ wallMs: sql<number>`min(${events.wallMs})` }).from(events).where(eq(events.runId, f.run.id));
    if (first?.wallMs == null) continue;
    const choiceAt = Math.round((Number(first.wallMs) + flights[0]!.launchAtMs) / 2);
    await db.insert(events).values({
      id: uuidv7({ msecs: choiceAt }), runId: f.run.id, deviceId: "demo-phone-ada", seq: 100_000 + i, recordedBy: ada.id, kind: "model",
      body: { kind: "model", lane: 0, modelId: f.model.id }, wallMs: choiceAt, monoMs: 1000, pageId: `demo-${f.run.id}`, correctedMs: choiceAt,
    });
    choices.push({ runId: f.run.id, flights, model: f.model, seed: 20261203 + i });
  }
  if (!process.env.S3_ENDPOINT || !process.env.S3_BUCKET) return; // no object storage (db:seed alone): models only
  for (const c of choices) await seedDemoLog(db, { ownerId: ada.id, ...c, fileName: c.seed === 20261203 ? "heron-evening.csv" : `${c.model.name.toLowerCase().replace(" ", "-")}-${c.seed - 20261203}.csv` });
  await db.insert(loggerMappings).values({ ownerId: ada.id, loggerName: "Pocket logger", mapping: DEMO_MAPPING });
}

/** An invented altimeter log of one demo run, read through the real detection and matching; the object and its row. */
async function seedDemoLog(db: Database, p: { ownerId: string; runId: string; flights: FlightInstant[]; model: { id: string; name: string }; seed: number; fileName: string }) {
  const csv = demoTrace(p.flights, p.seed, p.model.name === "Blue Tern" ? -6 : 0);
  const objectKey = newObjectKey(`logs/${p.runId}`);
  await putDemoObject(objectKey, csv.text);
  try {
    const matched = matchLaunches(detectLaunches(csv.samples), p.flights.map((f) => ({ id: String(f.index), atMs: f.launchAtMs })));
    await db.transaction(async (tx) => {
      const [log] = await tx.insert(altimeterLogs).values({
        ownerId: p.ownerId, runId: p.runId, lane: 0, objectKey, fileName: p.fileName, loggerName: "Pocket logger", sizeBytes: csv.text.length, status: "parsed", samples: csv.samples.length,
      }).returning();
      if (matched.launches.length === 0) return;
      await tx.insert(launchHeights).values(matched.launches.map((l) => ({
        logId: log!.id, runId: p.runId, lane: 0, atMs: Math.round(l.correctedMs), heightM: Math.round(l.heightM * 10) / 10,
        flightIndex: l.eventId === null ? null : Number(l.eventId), gapMs: l.gapMs === null ? null : Math.round(l.gapMs), modelId: p.model.id,
      })));
    });
  } catch (e) {
    await deleteObject(objectKey);
    throw e;
  }
}

/**
 * An invented 5 Hz log of these flights: a 3 s zoom to 40–75 m (`lowerM` lower for a heavier model;
 * longer flights launched a little higher, as in still air), a glide down to the landing; the logger's clock 3 s behind.
 */
function demoTrace(flights: readonly FlightInstant[], seed: number, lowerM = 0) {
  const rnd = mulberry32(seed);
  const shaped = flights.map((f) => {
    const land = Math.max(f.landAtMs ?? f.launchAtMs + 40_000, f.launchAtMs + 8000);
    const longer = Math.min(1, (land - f.launchAtMs) / 180_000);
    return { at: f.launchAtMs, peak: f.launchAtMs + 3000, land, h: 40 + lowerM + longer * 20 + rnd() * 15 };
  });
  const from = flights[0]!.launchAtMs - 60_000;
  const to = shaped[shaped.length - 1]!.land + 30_000;
  const samples: { tMs: number; hM: number }[] = [];
  for (let t = from; t <= to; t += 200) {
    const f = shaped.find((x) => t >= x.at && t < x.land);
    let h = 0;
    if (f) h = t <= f.peak ? f.h * (1 - ((f.peak - t) / 3000) ** 2) : f.h * (1 - (t - f.peak) / (f.land - f.peak));
    samples.push({ tMs: t - 3000, hM: Math.round((h + (rnd() - 0.5) * 0.2) * 10) / 10 });
  }
  const start = samples[0]!.tMs;
  const text = `seconds,altitude_m\n${samples.map((s) => `${((s.tMs - start) / 1000).toFixed(1)},${s.hM}`).join("\n")}\n`;
  return { samples, text };
}
