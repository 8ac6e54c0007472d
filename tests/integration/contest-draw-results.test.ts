import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { POST as drawRoute } from "@/app/api/contests/[contestId]/draw/route";
import { POST as lockRoute } from "@/app/api/contests/[contestId]/draw/lock/route";
import { POST as redrawRoute } from "@/app/api/contests/[contestId]/draw/redraw/route";
import { contestReflights } from "@/db/schema";
import { drawnContest as drawnThroughRoutes, inContest, json, reply } from "./support/contest-setup";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";

/**
 * Issue #15: a draw made again before the lock never deletes results flown in the preliminary rounds
 * without the officer's say-so: 409 `has_results` naming how many, nothing changed; then
 * `replaceResults: true` draws and deletes them (cards, runs, signatures and the old draw's re-flight grants).
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});


type Row = { round: number; group: number; entry: string; cards: unknown; signed: string | null };
async function state(contestId: string) {
  const slots = await db.execute<Row>(`select r.number as round, s.group_number as "group", s.entry_id::text as entry, s.paper_flights as cards, s.signed_at::text as signed
    from group_slots s join contest_rounds r on r.id = s.round_id where r.contest_id = '${contestId}' order by r.number, s.entry_id`);
  const grants = await db.execute<{ id: string; flights: unknown }>(`select g.id::text as id, g.paper_flights as flights from contest_reflights g
    join contest_rounds r on r.id = g.round_id where r.contest_id = '${contestId}' order by g.id`);
  const seed = await db.execute<{ draw_seed: number }>(`select draw_seed from contests where id = '${contestId}'`);
  return { slots: slots.rows, grants: grants.rows, seed: seed.rows[0]!.draw_seed };
}

/** 8 paper entries drawn over 5 rounds (seed 42), not locked. */
const drawnContest = (label: string) => drawnThroughRoutes({
  officerLabel: `${label}-officer`, clubName: `Draw Results Club ${label}`, cupName: `Draw Results Cup ${label}`,
  pilots: Array.from({ length: 8 }, (_, i) => ({ pilotName: `Pilot ${i + 1}` })),
});

describe("the draw and results already entered", () => {
  it("without results the draw is made again (201); an old draw's re-flight grant without a result goes with it", async () => {
    const { contestId } = await drawnContest("empty");
    const first = await state(contestId);
    const [roundOne] = (await db.execute<{ id: string }>(`select id::text from contest_rounds where contest_id = '${contestId}' and number = 1`)).rows;
    await db.insert(contestReflights).values({ roundId: roundOne!.id, entryId: first.slots[0]!.entry, cause: "launch-collision", placement: "original-group", groupNumber: first.slots[0]!.group });
    const res = await reply(await drawRoute(json({ seed: 7 }), inContest(contestId)));
    expect(res.status).toBe(201);
    const after = await state(contestId);
    expect(after.seed).toBe(7);
    expect(after.grants).toEqual([]);
  });

  it("refuses (409 has_results, how many in words) while a slot holds a card or a signature or a re-flight a result; nothing changes; replaceResults draws and deletes them", async () => {
    const { contestId } = await drawnContest("held");
    const first = await state(contestId);
    // two slots with results (a card; a signature only) and one re-flight with a card: three results
    await db.execute(`update group_slots set paper_flights = '[900]'::jsonb where entry_id = '${first.slots[0]!.entry}' and round_id = (select id from contest_rounds where contest_id = '${contestId}' and number = 1)`);
    await db.execute(`update group_slots set signed_at = now(), signed_from = 'paper' where entry_id = '${first.slots[1]!.entry}' and round_id = (select id from contest_rounds where contest_id = '${contestId}' and number = 2)`);
    const [roundThree] = (await db.execute<{ id: string }>(`select id::text from contest_rounds where contest_id = '${contestId}' and number = 3`)).rows;
    await db.insert(contestReflights).values({ roundId: roundThree!.id, entryId: first.slots[2]!.entry, cause: "launch-collision", placement: "original-group", groupNumber: 1, paperFlights: [800] });
    const before = await state(contestId);

    const refused = await reply(await drawRoute(json({ seed: 7 }), inContest(contestId)));
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("has_results");
    expect(refused.body.error.message).toBe("3 results are already entered in the preliminary rounds (paper cards, timed runs or signatures). A new draw deletes them: nothing was drawn. Confirm to draw again anyway.");
    expect(await state(contestId)).toEqual(before);
    // an explicit false is the same refusal
    expect((await drawRoute(json({ seed: 7, replaceResults: false }), inContest(contestId))).status).toBe(409);
    // a value that is not a yes/no is refused (422) and changes nothing
    expect((await drawRoute(json({ seed: 7, replaceResults: "yes" }), inContest(contestId))).status).toBe(422);
    expect(await state(contestId)).toEqual(before);

    const replaced = await reply(await drawRoute(json({ seed: 7, replaceResults: true }), inContest(contestId)));
    expect(replaced.status).toBe(201);
    const after = await state(contestId);
    expect(after.seed).toBe(7);
    expect(after.slots.every((s) => s.cards === null && s.signed === null)).toBe(true);
    expect(after.slots).toHaveLength(before.slots.length);
    expect(after.grants).toEqual([]);
  });

  it("one result: the words say so in the singular", async () => {
    const { contestId } = await drawnContest("one");
    await db.execute(`update group_slots set paper_flights = '[900]'::jsonb where id = (select s.id from group_slots s join contest_rounds r on r.id = s.round_id where r.contest_id = '${contestId}' limit 1)`);
    const refused = await reply(await drawRoute(json({}), inContest(contestId)));
    expect(refused.body.error.message).toMatch(/^1 result is already entered .* A new draw deletes it: nothing was drawn\./);
  });

  it("the re-draw of remaining rounds after the lock is refused while one of them has a re-flight with a result, and nothing changes", async () => {
    const { contestId } = await drawnContest("redraw");
    expect((await lockRoute(json({}), inContest(contestId))).status).toBe(200);
    const first = await state(contestId);
    const [roundFour] = (await db.execute<{ id: string }>(`select id::text from contest_rounds where contest_id = '${contestId}' and number = 4`)).rows;
    await db.insert(contestReflights).values({ roundId: roundFour!.id, entryId: first.slots[0]!.entry, cause: "launch-collision", placement: "original-group", groupNumber: 1, paperFlights: [800] });
    const before = await state(contestId);
    const refused = await reply(await redrawRoute(json({ fromRound: 3, seed: 5 }), inContest(contestId)));
    expect(refused).toMatchObject({ status: 409, body: { error: { code: "flown", message: "Round 4 has results already: re-draw from a later round." } } });
    expect(await state(contestId)).toEqual(before);
    // from round 5 on there is nothing flown: allowed
    expect((await redrawRoute(json({ fromRound: 5, seed: 5 }), inContest(contestId))).status).toBe(201);
  });
});
