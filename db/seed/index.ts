import { eq } from "drizzle-orm";
import { hashPassword } from "@/lib/auth/password";
import type { Database } from "../index";
import { clubs, coachGrants, devices, events, fieldSessions, memberships, runLanes, runs, users } from "../schema";
import { deriveAllRuns } from "../queries/runs";
import { DEMO_CLUB, DEMO_PASSWORD, DEMO_PEOPLE } from "./demo-people";
import { seedAdminDemo } from "./admin-demo";
import { seedClubs } from "./clubs";
import { seedCoaching } from "./coaching";
import { seedDemoContest } from "./demo-contest";
import { seedFieldDays } from "./field-days";
import { seedRecordedFor } from "./recorded-for";
import { seedHangar } from "./hangar";
import { seedSeasonContest } from "./season-contest";
import { makeRandom, pickTask, simulateWindow } from "./simulate";
import { v7 as uuidv7 } from "uuid";

const SEASON_START = Date.UTC(2026, 2, 7, 10, 0); // Sat 7 March 2026, 10:00 UTC
const WEEK = 7 * 24 * 3600 * 1000;

/** Seeds the invented demo club with a season of practice; does nothing when it is already there. */
export async function seedDemo(db: Database): Promise<"seeded" | "present"> {
  const [existing] = await db.select({ id: clubs.id }).from(clubs).where(eq(clubs.slug, DEMO_CLUB.slug));
  if (existing) {
    await seedHangar(db); // a database seeded before the hangar existed gets its demo too
    await seedClubs(db, () => hashPassword(DEMO_PASSWORD));
    await seedDemoContest(db);
    await seedCoaching(db);
    await seedFieldDays(db);
    return "present";
  }
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db.transaction(async (tx) => {
    const [club] = await tx.insert(clubs).values(DEMO_CLUB).returning();
    const ids = new Map<string, string>();
    for (const p of DEMO_PEOPLE) {
      const [u] = await tx.insert(users).values({ email: p.email, name: p.name, passwordHash, role: p.globalRole, emailVerifiedAt: new Date(SEASON_START) }).returning();
      ids.set(p.key, u!.id);
      if (p.clubRole) await tx.insert(memberships).values({ clubId: club!.id, userId: u!.id, role: p.clubRole });
    }
    const coachId = ids.get("coach")!;
    const random = makeRandom(20260307);
    for (const pilot of DEMO_PEOPLE.filter((p) => p.skill !== null)) {
      const pilotId = ids.get(pilot.key)!;
      const deviceId = `demo-phone-${pilot.key}`;
      await tx.insert(devices).values({ id: deviceId, userId: pilotId, label: `${pilot.name}'s phone` });
      if (pilot.key !== "lena") await tx.insert(coachGrants).values({ pilotId, coachId });
      let seq = 0;
      for (let week = 0; week < 37; week += 1 + Math.floor(random() * 3)) {
        const startedAt = SEASON_START + week * WEEK + Math.floor(random() * 4) * 3600_000;
        const sessionId = uuidv7({ msecs: startedAt });
        const wind = Math.round(random() * 60) / 10;
        await tx.insert(fieldSessions).values({
          id: sessionId, ownerId: pilotId, clubId: club!.id, fieldName: DEMO_CLUB.homeField,
          conditions: { windMs: wind, gustMs: Math.round((wind + random() * 3) * 10) / 10, temperatureC: Math.round(8 + random() * 20) },
          startedAt: new Date(startedAt),
        });
        const runCount = 2 + Math.floor(random() * 2);
        for (let r = 0; r < runCount; r++) {
          const task = pickTask(random);
          const runStart = startedAt + r * 25 * 60_000;
          const runId = uuidv7({ msecs: runStart });
          await tx.insert(runs).values({
            id: runId, sessionId, createdBy: pilotId, task, taskCode: task.letter ?? "custom", edition: task.edition,
            createdAt: new Date(runStart - 60_000),
          });
          await tx.insert(runLanes).values({ runId, lane: 0, pilotUserId: pilotId, pilotName: pilot.name });
          const taps = simulateWindow(task, pilot.skill! * (0.85 + random() * 0.15 + week / 400), random);
          await tx.insert(events).values(
            taps.map((tap) => {
              const wallMs = runStart + tap.atOffsetMs;
              seq += 1;
              return {
                id: uuidv7({ msecs: wallMs }), runId, deviceId, seq, recordedBy: pilotId, kind: tap.body.kind, body: tap.body,
                wallMs, monoMs: tap.atOffsetMs + 1000, pageId: `demo-${runId}`,
                offsetThetaMs: 0, offsetDeltaMs: 24, offsetMeasuredAtMs: runStart - 120_000, correctedMs: wallMs, uncertaintyMs: 12,
              };
            }),
          );
        }
      }
    }
    const person = (key: string) => {
      const p = DEMO_PEOPLE.find((x) => x.key === key)!;
      return { id: ids.get(key)!, name: p.name, skill: p.skill ?? 0.5 };
    };
    await seedRecordedFor(tx, {
      clubId: club!.id, field: DEMO_CLUB.homeField, startedAt: SEASON_START + 37 * WEEK + 7 * 3600_000, keeper: person("tobi"), pilot: person("ada"),
      backupDeviceId: "demo-phone-tobi",
    });
    await seedAdminDemo(tx, {
      adminId: ids.get("admin")!, pilotId: ids.get("lena")!, pilotEmail: "lena@example.com", passwordHash, at: SEASON_START + 38 * WEEK,
    });
    await seedSeasonContest(tx, { clubId: club!.id, field: DEMO_CLUB.homeField, pilot: person("ada") });
    // results are derived from the events, as a push would (SYNC.md §1)
    await deriveAllRuns(tx);
  });
  await seedHangar(db);
  await seedClubs(db, async () => passwordHash);
  await seedDemoContest(db);
  await seedCoaching(db);
  await seedFieldDays(db);
  return "seeded";
}
