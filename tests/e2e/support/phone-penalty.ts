import type pg from "pg";
import { v7 as uuidv7 } from "uuid";
import { insertTrialContest } from "./contest-db";

/**
 * A contest of three invented pilots in round 1 (task A): two signed paper cards (Wren 180.0 s, Sol 200.0 s) and
 * Tam Ossory, whose time Ines (the demo club's officer) keeps on her phone.
 */
export async function insertPenaltyTrial(db: pg.Client, contest: { name: string; startsOn: string; drawSeed: number }) {
  const { contestId, round1 } = await insertTrialContest(db, contest);
  const { rows: [ines] } = await db.query<{ id: string }>("select id from users where email = 'ines@example.com'");
  const ids: Record<string, string> = {};
  for (const [name, tenths] of [["Wren Albery", 1800], ["Sol Penhallow", 2000], ["Tam Ossory", null]] as const) {
    const { rows: [e] } = await db.query<{ id: string }>("insert into contest_entries (contest_id, pilot_name, paper) values ($1, $2, true) returning id", [contestId, name]);
    ids[name] = e!.id;
    if (tenths === null) await db.query("insert into group_slots (round_id, group_number, entry_id, timekeeper_user_id) values ($1, 1, $2, $3)", [round1, e!.id, ines!.id]);
    else await db.query("insert into group_slots (round_id, group_number, entry_id, paper_flights, signed_at, signed_from, recorded_at) values ($1, 1, $2, $3, now(), 'paper card', now())", [round1, e!.id, JSON.stringify([tenths])]);
  }
  const { rows: [round] } = await db.query<{ task: unknown }>("select task from contest_rounds where id = $1", [round1]);
  return { contestId, round1, inesId: ines!.id, ids, task: round!.task };
}

/**
 * A pushed timekeeper's run (the phone's sync body, SYNC.md): lane 0 for `entryId` in the round, one flight of
 * `secs`, a penalty in that attempt, signed.
 */
export function phonePenaltyRun(o: { userId: string; roundId: string; entryId: string; pilotName: string; task: unknown; secs: number; penalty: { reason: string; cause: string } }) {
  const deviceId = `e2e-phone-${uuidv7()}`;
  const t0 = Date.now() - 600_000;
  let seq = 0;
  const sessionId = uuidv7(), runId = uuidv7(), launchId = uuidv7();
  const at = (ms: number, body: Record<string, unknown>, id = uuidv7()) => ({ id, runId, deviceId, seq: ++seq, stamp: { wallMs: ms, monoMs: ms, pageId: `page-${deviceId}`, offset: null }, body });
  return {
    runId,
    body: {
      deviceId,
      sessions: [{ id: sessionId, ownerId: o.userId, fieldName: "Five Acre Meadow", conditions: { windMs: 3 }, startedAtWallMs: t0 - 60_000 }],
      runs: [{ id: runId, sessionId, task: o.task, lanes: [{ lane: 0, pilotName: o.pilotName }], createdAtWallMs: t0 - 30_000, contest: { roundId: o.roundId, slots: [{ lane: 0, entryId: o.entryId }] } }],
      events: [
        at(t0, { kind: "window-start" }),
        at(t0 + 1000, { kind: "launch", lane: 0 }, launchId),
        at(t0 + 1000 + o.secs * 1000, { kind: "landing", lane: 0 }),
        at(t0 + 2000 + o.secs * 1000, { kind: "penalty", lane: 0, points: 100, reason: o.penalty.reason, cause: o.penalty.cause, launchId }),
        at(t0 + 3000 + o.secs * 1000, { kind: "signed", lane: 0 }),
      ],
    },
  };
}
