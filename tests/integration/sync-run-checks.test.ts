import { afterAll, describe, expect, it } from "vitest";
import { v7 as uuidv7 } from "uuid";
import { applyPush } from "@/db/queries/sync-push";
import { MAX_RUNS_PER_DAY } from "@/lib/validations/sync-push";
import { createSimUsers } from "./sync-sim";
import { db, getPool } from "./support/db";
import { deviceId, run, session } from "./sync-fixtures";

/**
 * The checks of pushed runs read their facts in one statement (db/queries/sync-push-entities.ts
 * runFacts): the runs-per-day cap, run ids already taken, the session's owner and named pilots.
 */
describe("checks of pushed runs", () => {
  afterAll(async () => {
    await getPool().end();
  });

  it(`refuses the run past ${MAX_RUNS_PER_DAY} on one UTC day, counting the stored ones, and keeps the next day's`, async () => {
    const [user, other] = await createSimUsers(db, 2);
    const device = deviceId();
    const s = session(user!.id);
    const day = (n: number, at: number) => Array.from({ length: n }, () => ({ ...run(s.id, [{ lane: 0, pilotName: "Test pilot" }]), createdAtWallMs: at }));
    const first = day(MAX_RUNS_PER_DAY - 1, 1_767_000_060_000);
    const r1 = await applyPush(db, user!.id, { deviceId: device, sessions: [s], runs: first, events: [] });
    expect(r1.acks.filter((a) => a.status === "applied")).toHaveLength(MAX_RUNS_PER_DAY);

    // one more fits that day; the one after is refused; a run of the next day is kept
    const [fits, over] = day(2, 1_767_000_070_000);
    const nextDay = { ...run(s.id, [{ lane: 0, pilotName: "Test pilot" }]), createdAtWallMs: 1_767_000_070_000 + 86_400_000 };
    // a lane naming an account that does not exist
    const ghost = run(s.id, [{ lane: 0, pilotName: "Nobody", pilotUserId: uuidv7() }]);
    const r2 = await applyPush(db, user!.id, { deviceId: device, sessions: [], runs: [fits!, over!, nextDay, ghost], events: [] });
    const ack = (id: string) => r2.acks.find((a) => a.id === id);
    expect(ack(fits!.id)?.status).toBe("applied");
    expect(ack(over!.id)).toMatchObject({ status: "rejected", reason: `You already have ${MAX_RUNS_PER_DAY} runs on that day, the most one account may record per day.` });
    expect(ack(nextDay.id)?.status).toBe("applied");
    expect(ack(ghost.id)?.status).toBe("rejected");
    expect(r2.acks).toHaveLength(4);

    // the same run id pushed by another account is refused; pushed again by its creator it is a duplicate
    const r3 = await applyPush(db, other!.id, { deviceId: deviceId(), sessions: [], runs: [{ ...fits! }], events: [] });
    expect(r3.acks[0]).toMatchObject({ status: "rejected", reason: "This run id is already used by someone else." });
    const r4 = await applyPush(db, user!.id, { deviceId: device, sessions: [], runs: [fits!], events: [] });
    expect(r4.acks[0]?.status).toBe("duplicate");
  });
});
