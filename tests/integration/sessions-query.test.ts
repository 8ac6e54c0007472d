import { afterAll, describe, expect, it } from "vitest";
import { eq, inArray } from "drizzle-orm";
import { listRecentSessions } from "@/db/queries/sessions";
import { fieldSessions, runs } from "@/db/schema";
import { db, demoUser, getPool } from "./support/db";

afterAll(async () => {
  await getPool().end();
});

describe("listRecentSessions", () => {
  it("counts each session's runs and names its tasks, newest first", async () => {
    const ada = await demoUser("ada@example.com");
    const sessions = await listRecentSessions(db, { userId: ada.id, limit: 10 });
    expect(sessions).toHaveLength(10);
    for (const s of sessions) {
      const rows = await db.select({ code: runs.taskCode }).from(runs).where(eq(runs.sessionId, s.id));
      expect(s.runCount).toBe(rows.length);
      expect(s.taskCodes).toEqual([...new Set(rows.map((r) => r.code))].sort());
    }
    // Other integration tests add sessions of their own; the seeded season has 2–3 runs a session.
    expect(sessions.some((s) => s.runCount >= 2)).toBe(true);
    const times = sessions.map((s) => s.startedAt.getTime());
    expect(times).toEqual([...times].sort((a, b) => b - a));
  });

  it("shows nobody else's sessions", async () => {
    const lena = await demoUser("lena@example.com");
    const sessions = await listRecentSessions(db, { userId: lena.id, limit: 50 });
    const owners = await db.selectDistinct({ ownerId: fieldSessions.ownerId }).from(fieldSessions).where(inArray(fieldSessions.id, sessions.map((s) => s.id)));
    expect(owners).toEqual([{ ownerId: lena.id }]);
  });
});
