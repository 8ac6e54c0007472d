import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { coachGrants } from "@/db/schema";
import { getRoster } from "@/db/queries/coach/roster";
import { db, freshUser, getPool } from "./support/db";
import { pushingAs, T0 } from "./sync-fixtures";

afterAll(async () => {
  await getPool().end();
});

describe("the coach's roster, aggregated in SQL", () => {
  it("gives each granting pilot's last session, runs this month, result share and median turnaround (hand-computed)", async () => {
    const pilot = await freshUser("roster-pilot");
    const quiet = await freshUser("roster-quiet");
    const stranger = await freshUser("roster-stranger");
    const coach = await freshUser("roster-coach");
    await db.insert(coachGrants).values([{ pilotId: pilot.id, coachId: coach.id }, { pilotId: quiet.id, coachId: coach.id }]);
    // task H (1, 2, 3 and 4 minutes; its maximum is 596 s by lib/tasks/limits.ts): flights of 60 s and 120 s landing 1 s before the next launch
    const { phone, run: r, send } = pushingAs(pilot);
    const res = await send([phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [60, 120], T0 + 1000)]);
    expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
    const other = pushingAs(stranger);
    await other.send([other.phone.at(other.run.id, T0, { kind: "window-start" }), ...other.phone.flights(other.run.id, 0, [30], T0 + 1000)]);

    const roster = await getRoster(db, coach.id, new Date(T0 + 24 * 3600_000)); // the next day, same month
    expect(roster.map((p) => p.pilotId).sort()).toEqual([pilot.id, quiet.id].sort());
    const flown = roster.find((p) => p.pilotId === pilot.id)!;
    expect(flown).toMatchObject({ runsThisMonth: 1, lastSessionAt: new Date(1_767_000_000_000).toISOString() });
    expect(flown.result.recent).toBeCloseTo(180 / 596, 5);
    expect(flown.turnaround.recent).toBeCloseTo(1.0, 5); // landing at 1:01.0, relaunch at 1:02.0
    expect([flown.result.before, flown.turnaround.before]).toEqual([null, null]);
    expect(roster.find((p) => p.pilotId === quiet.id)).toMatchObject({ runsThisMonth: 0, lastSessionAt: null, result: { recent: null } });

    const nextMonth = await getRoster(db, coach.id, new Date(T0 + 40 * 24 * 3600_000)); // 40 days on: the run counts as "before"
    const later = nextMonth.find((p) => p.pilotId === pilot.id)!;
    expect(later.runsThisMonth).toBe(0);
    expect(later.result).toEqual({ recent: null, before: expect.closeTo(180 / 596, 5) });
    expect(later.turnaround).toEqual({ recent: null, before: expect.closeTo(1.0, 5) });
  });
});
