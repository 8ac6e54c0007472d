import "./support/session";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDayBoard } from "@/db/queries/club-day-board";
import { holdOpenDays } from "@/db/queries/club-day-locks";
import { openClubDay } from "@/db/queries/club-days";
import { clubFields, clubs, memberships } from "@/db/schema";
import { db, freshUser, getPool } from "./support/db";
import { addPhone, dayRun, measure } from "./support/day-records";
import type { MockSessionUser } from "./support/session";

/**
 * Issue #14: runs join a day "by field and time". Where the club's field and the phone's session both
 * have a position, the place decides (within 1 km, our choice: lib/days/matching.ts FIELD_RADIUS_M),
 * whatever name the phone typed; a session with the field's name at another place is another field.
 * Without a position on either side, the name decides. Invented place: "Hill Pasture" at 46.9000 N,
 * 7.1000 E. One degree of latitude is R·π/180 ≈ 111.195 km on the mean sphere (R = 6 371 008.8 m).
 */
const DAY = "2026-08-08";
const FIELD = { latitude: 46.9, longitude: 7.1 };
const north = (m: number) => ({ latitude: FIELD.latitude + m / 111_195.08, longitude: FIELD.longitude });
let clubId = "";
let dayId = "";
let pilot: MockSessionUser;
const ids: Record<string, string> = {};

beforeAll(async () => {
  pilot = await freshUser("pos-pilot");
  const [club] = await db.insert(clubs).values({ name: "Hill Pasture Gliders", slug: `hill-pasture-${Date.now()}` }).returning();
  clubId = club!.id;
  await db.insert(memberships).values({ clubId, userId: pilot.id, role: "officer" });
  const [field] = await db.insert(clubFields).values({ clubId, name: "Hill Pasture", ...FIELD }).returning();
  const opened = await openClubDay(db, { clubId, fieldId: field!.id, day: DAY, userId: pilot.id });
  if (!opened || opened === "closed") throw new Error("the day did not open");
  dayId = opened.day.id;
  const phone = await addPhone(pilot.id, 0, 30, "pos");
  await measure(phone, Date.parse(`${DAY}T09:00:00Z`));
  const flown = (field: string, at: string, position?: { latitude: number; longitude: number }) =>
    dayRun({ creatorId: pilot.id, field, at, pilots: [pilot.id], position, records: [{ phone, signals: true, lanes: { 0: [[5, 50]] } }] });
  ids.renamed = await flown("Windsock corner", `${DAY}T10:00:00Z`, north(400)); // the right place, another name
  ids.elsewhere = await flown("Hill Pasture", `${DAY}T11:00:00Z`, north(20_000)); // the name, 20 km away
  ids.noFix = await flown("hill  pasture", `${DAY}T12:00:00Z`); // no position: the name
  ids.nextDoor = await flown("Hill Pasture", `${DAY}T13:00:00Z`, north(1200)); // just outside the radius
});

afterAll(async () => {
  await getPool().end();
});

describe("a field day's runs by place, then by name", () => {
  it("a run at the field under another name joins and is listed at the field; the same name elsewhere does not", async () => {
    const board = (await getDayBoard(db, { clubId, day: DAY }))!;
    expect(board.runs.map((r) => [r.runId, r.fieldName])).toEqual([
      [ids.renamed, "Hill Pasture"],
      [ids.noFix, "Hill Pasture"],
    ]);
  });

  it("a push of a run at the place holds the day against a close, whatever its name (club-day-locks.ts)", async () => {
    const held = await db.transaction((tx) => tx.execute<{ id: string }>(sql`${holdOpenDays(sql`${ids.renamed}::uuid`)}`));
    // this club's day (other clubs' days at a field there, from earlier runs of this file, are held too: right)
    expect(held.rows.map((r) => r.id)).toContain(dayId);
  });
});
