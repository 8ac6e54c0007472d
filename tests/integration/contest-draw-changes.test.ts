import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { POST as swapRoute } from "@/app/api/contests/[contestId]/draw/swap/route";
import { POST as redrawRoute } from "@/app/api/contests/[contestId]/draw/redraw/route";
import { listDrawChanges } from "@/db/queries/contest-draw-changes";
import { drawnContest, inContest, json, reply } from "./support/contest-setup";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";

/** Issue #15: the officer swaps two pilots of a round and re-draws the rounds not flown yet, after the draw is locked. */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});


type Slot = { round: number; group: number; entry: string; name: string; run: string | null };
async function slotsOf(contestId: string): Promise<Slot[]> {
  const r = await db.execute<Slot>(`select r.number as round, s.group_number as "group", s.entry_id::text as entry, e.pilot_name as name, s.run_id::text as run
    from group_slots s join contest_rounds r on r.id = s.round_id join contest_entries e on e.id = s.entry_id
    where r.contest_id = '${contestId}' order by r.number, s.group_number, e.pilot_name`);
  return r.rows;
}

/** A locked draw of 12 paper entries (two with one keep-apart word) over 5 rounds in groups of at most 6. */
const lockedContest = (label: string, drawIt = true) => drawnContest({
  officerLabel: `${label}-officer`, clubName: `Draw Club ${label}`, cupName: `Draw Cup ${label}`, draw: drawIt, lock: true,
  pilots: Array.from({ length: 12 }, (_, i) => ({ pilotName: `Pilot ${String(i + 1).padStart(2, "0")}`, keepApart: i < 2 ? "shared helper" : null })),
});

describe("changing a locked draw", () => {
  it("swaps two pilots of different groups of one round, records who and why, and changes no other slot", async () => {
    const { officer, contestId } = await lockedContest("swap");
    const before = await slotsOf(contestId);
    const round2 = before.filter((s) => s.round === 2);
    const a = round2.find((s) => s.group === 1 && s.name !== "Pilot 01" && s.name !== "Pilot 02")!;
    const b = round2.find((s) => s.group === 2 && s.name !== "Pilot 01" && s.name !== "Pilot 02")!;
    const res = await reply(await swapRoute(json({ round: 2, a: a.entry, b: b.entry }), inContest(contestId)));
    expect(res.status).toBe(200);
    const after = await slotsOf(contestId);
    const moved = (s: Slot) => s.round === 2 && (s.entry === a.entry || s.entry === b.entry);
    expect(after.filter((s) => !moved(s))).toEqual(before.filter((s) => !moved(s)));
    expect(after.find((s) => s.round === 2 && s.entry === a.entry)!.group).toBe(2);
    expect(after.find((s) => s.round === 2 && s.entry === b.entry)!.group).toBe(1);
    const changes = await listDrawChanges(db, contestId);
    expect(changes.map((c) => [c.summary, c.by])).toEqual([[`Round 2: ${a.name} (to group 2) and ${b.name} (to group 1) traded groups.`, officer.name]]);
  });

  it("refuses a swap of one group, a swap breaking a keep-apart and a swap in a round with a result, with the reason, changing nothing", async () => {
    const { contestId } = await lockedContest("refuse");
    const before = await slotsOf(contestId);
    const r1 = before.filter((s) => s.round === 1);
    const sameGroup = r1.filter((s) => s.group === 1);
    const same = await reply(await swapRoute(json({ round: 1, a: sameGroup[0]!.entry, b: sameGroup[1]!.entry }), inContest(contestId)));
    expect(same).toEqual({ status: 409, body: { error: { code: "refused", message: `${sameGroup[0]!.name} and ${sameGroup[1]!.name} already fly in group 1.` } } });

    // Pilot 01 and Pilot 02 share a keep-apart word: Pilot 01 may not move into Pilot 02's group
    const p1 = r1.find((s) => s.name === "Pilot 01")!;
    const p2 = r1.find((s) => s.name === "Pilot 02")!;
    expect(p1.group).not.toBe(p2.group);
    const other = r1.find((s) => s.group === p2.group && s.entry !== p2.entry)!;
    const apart = await reply(await swapRoute(json({ round: 1, a: p1.entry, b: other.entry }), inContest(contestId)));
    expect(apart.status).toBe(409);
    expect(apart.body.error.message).toBe(`Pilot 01 is to be kept apart from Pilot 02, who flies in group ${p2.group}.`);

    await db.execute(`update group_slots set run_id = gen_random_uuid() where entry_id = '${r1[0]!.entry}' and round_id = (select id from contest_rounds where contest_id = '${contestId}' and number = 1)`);
    const flown = await reply(await swapRoute(json({ round: 1, a: p1.entry, b: p2.entry }), inContest(contestId)));
    expect(flown.status).toBe(409);
    expect(flown.body.error.message).toBe("Round 1 has results already: its groups can no longer change.");
    const placed = (rows: Slot[]) => rows.map((s) => [s.round, s.group, s.entry]);
    expect(placed(await slotsOf(contestId))).toEqual(placed(before));
    expect(await listDrawChanges(db, contestId)).toEqual([]);
  });

  it("re-draws the rounds from 3 on for today's entries, keeps rounds 1–2, and refuses to re-draw a round with a result", async () => {
    const { contestId } = await lockedContest("redraw");
    const before = await slotsOf(contestId);
    // one pilot withdraws on the day
    const gone = before.find((s) => s.name === "Pilot 07")!.entry;
    await db.execute(`update contest_entries set withdrawn_at = now() where id = '${gone}'`);
    const res = await reply(await redrawRoute(json({ fromRound: 3, seed: 9 }), inContest(contestId)));
    expect(res.status).toBe(201);
    expect(res.body).toEqual(expect.objectContaining({ seed: 9, summary: "Rounds 3–5 drawn again for 11 pilots (seed 9).", apartBroken: 0 }));
    const after = await slotsOf(contestId);
    expect(after.filter((s) => s.round <= 2)).toEqual(before.filter((s) => s.round <= 2));
    for (const round of [3, 4, 5]) {
      const here = after.filter((s) => s.round === round);
      expect(here).toHaveLength(11);
      expect(here.some((s) => s.entry === gone)).toBe(false);
      // 11 pilots in groups of at most 6: two groups (F3K.9.1, at least 5 a group)
      expect(new Set(here.map((s) => s.group)).size).toBe(2);
      const p1 = here.find((s) => s.name === "Pilot 01")!;
      const p2 = here.find((s) => s.name === "Pilot 02")!;
      expect(p1.group).not.toBe(p2.group);
    }
    // a result in round 4 stops a re-draw from 3, with the round named, and nothing changes
    await db.execute(`update group_slots set run_id = gen_random_uuid() where entry_id = '${after.find((s) => s.round === 4)!.entry}' and round_id = (select id from contest_rounds where contest_id = '${contestId}' and number = 4)`);
    const refused = await reply(await redrawRoute(json({ fromRound: 3 }), inContest(contestId)));
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe("Round 4 has results already: re-draw from a later round.");
    expect((await slotsOf(contestId)).filter((s) => s.round !== 4)).toEqual(after.filter((s) => s.round !== 4));
    // a paper card (flight times typed from the card) is a result too
    await db.execute(`update group_slots set paper_flights = '[1200]' where entry_id = '${after.find((s) => s.round === 5)!.entry}' and round_id = (select id from contest_rounds where contest_id = '${contestId}' and number = 5)`);
    const card = await reply(await redrawRoute(json({ fromRound: 5 }), inContest(contestId)));
    expect(card.status).toBe(409);
    expect(card.body.error.message).toBe("Round 5 has results already: re-draw from a later round.");
    expect((await listDrawChanges(db, contestId)).map((c) => c.summary)).toEqual(["Rounds 3–5 drawn again for 11 pilots (seed 9)."]);
  });

  it("answers a round the contest does not have, or a contest with no draw, with a 409 and its reason; a bad body with 422", async () => {
    const { contestId } = await lockedContest("missing");
    const none = await reply(await redrawRoute(json({ fromRound: 6 }), inContest(contestId)));
    expect(none).toEqual({ status: 409, body: { error: { code: "no_round", message: "The contest has no round 6." } } });
    const bad = await reply(await swapRoute(json({ round: 0, a: "x", b: "y" }), inContest(contestId)));
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body)).toContain("Choose a round.");
    const undrawn = (await lockedContest("undrawn", false)).contestId;
    const first = await reply(await redrawRoute(json({ fromRound: 1 }), inContest(undrawn)));
    expect(first).toEqual({ status: 409, body: { error: { code: "no_draw", message: "Make the draw first." } } });
    expect(await slotsOf(undrawn)).toEqual([]);
  });
});
