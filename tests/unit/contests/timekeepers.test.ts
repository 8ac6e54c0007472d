import { describe, expect, it } from "vitest";
import { dutyContest, dutyLanes, dutyText, MAX_PILOTS_PER_TIMEKEEPER, reflightTimekeeperProblem, timekeeperProblem } from "@/lib/contests/timekeepers";
import { foldRun, getCatalogueTask } from "@/lib/tasks";
import { eventLog } from "../tasks/helpers";

/** Issue 15, on the day: which timekeeper choices an officer may save, and the lanes a duty sets up. */

const group = [
  { entryId: "e1", pilotUserId: "u1" }, { entryId: "e2", pilotUserId: null }, { entryId: "e3", pilotUserId: "u3" },
  { entryId: "e4", pilotUserId: null }, { entryId: "e5", pilotUserId: null }, { entryId: "e6", pilotUserId: null },
];
const eligible = new Set(["k1", "k2", "u1", "u3", "u9"]);

describe("timekeeperProblem", () => {
  it("accepts a member or an entered pilot who does not fly in the group, and clearing a choice", () => {
    expect(timekeeperProblem(group, eligible, [{ entryId: "e1", timekeeperUserId: "k1" }, { entryId: "e2", timekeeperUserId: "u9" }, { entryId: "e3", timekeeperUserId: null }])).toBeNull();
  });
  it("refuses a timekeeper who flies in that group (common practice: a pilot flying the window cannot time it)", () => {
    expect(timekeeperProblem(group, eligible, [{ entryId: "e2", timekeeperUserId: "u1" }])).toMatch(/flies in this group/);
    // nor may a pilot time their own lane
    expect(timekeeperProblem(group, eligible, [{ entryId: "e3", timekeeperUserId: "u3" }])).toMatch(/flies in this group/);
  });
  it("refuses someone neither in the club nor entered, a pilot not in the group, and a pilot named twice", () => {
    expect(timekeeperProblem(group, eligible, [{ entryId: "e2", timekeeperUserId: "stranger" }])).toMatch(/member of the club/);
    expect(timekeeperProblem(group, eligible, [{ entryId: "e99", timekeeperUserId: "k1" }])).toMatch(/not drawn/);
    expect(timekeeperProblem(group, eligible, [{ entryId: "e2", timekeeperUserId: "k1" }, { entryId: "e2", timekeeperUserId: "k2" }])).toMatch(/twice/);
  });
  it("allows four pilots for one timekeeper (a run holds lanes 0–3), not five, counting what stays stored", () => {
    const four = ["e2", "e4", "e5", "e6"].map((entryId) => ({ entryId, timekeeperUserId: "k1" }));
    expect(MAX_PILOTS_PER_TIMEKEEPER).toBe(4);
    expect(timekeeperProblem(group, eligible, four)).toBeNull();
    expect(timekeeperProblem(group, eligible, [...four, { entryId: "e1", timekeeperUserId: "k1" }])).toMatch(/at most 4/);
    // e1 already kept by k1 and not named now: it still counts
    expect(timekeeperProblem(group, eligible, four, [{ entryId: "e1", timekeeperUserId: "k1" }])).toMatch(/at most 4/);
    // a stored choice the request replaces does not count twice
    expect(timekeeperProblem(group, eligible, four, [{ entryId: "e2", timekeeperUserId: "k1" }])).toBeNull();
  });
});

describe("a duty on the phone", () => {
  const duty = { roundNumber: 3, groupNumber: 2, pilots: [{ entryId: "a", name: "Ilse Brook" }, { entryId: "b", name: "Oren Vale" }, { entryId: "c", name: "Pia Thorn" }] };
  it("reads as the Field shows it", () => {
    expect(dutyText(duty)).toBe("round 3, group 2 — pilots Ilse Brook, Oren Vale, Pia Thorn");
    // a fly-off round is numbered on its own (F3K.10): the phone says which it is
    expect(dutyText({ ...duty, flyOff: true })).toBe("fly-off round 3, group 2 — pilots Ilse Brook, Oren Vale, Pia Thorn");
  });
  it("gets one named lane per pilot, each tied to the pilot's entry", () => {
    expect(dutyLanes(duty)).toEqual({
      lanes: [{ lane: 0, pilotName: "Ilse Brook" }, { lane: 1, pilotName: "Oren Vale" }, { lane: 2, pilotName: "Pia Thorn" }],
      slots: [{ lane: 0, entryId: "a" }, { lane: 1, entryId: "b" }, { lane: 2, entryId: "c" }],
    });
  });
});

describe("a signature on the phone", () => {
  it("does not change a lane's result (only the contest slot records it; F3K.1.2 zeroes unsigned results in the standings)", () => {
    // Task A: the last flight counts, up to 300 s (RULES.md task table)
    const A = getCatalogueTask("A");
    const log = eventLog();
    log.start(0);
    log.launch(1_000);
    log.land(121_000);
    const before = foldRun(A, log.events).lanes[0]!;
    log.add(130_000, { kind: "run-end" });
    log.add(131_000, { kind: "signed", lane: 0 });
    const after = foldRun(A, log.events).lanes[0]!;
    expect(before.resultTenths).toBe(1200);
    expect(after.resultTenths).toBe(1200);
    expect(after.flights).toEqual(before.flights);
  });
});

describe("a re-flight's timekeeper and duty (issue 15)", () => {
  const eligible = new Set(["keeper", "flyer"]);
  it("the same rules as a group's: eligible, and not flying in the group the re-flight is flown in (common practice, F3K.9.1: a group flies together)", () => {
    expect(reflightTimekeeperProblem("keeper", eligible, new Set(["flyer"]))).toBeNull();
    expect(reflightTimekeeperProblem("flyer", eligible, new Set(["flyer"]))).toMatch(/flies in the group the re-flight is flown in/);
    expect(reflightTimekeeperProblem("outsider", eligible, new Set())).toMatch(/member of the club or a pilot entered/);
  });

  it("a re-flight duty reads \"re-flight, round N, group G — pilot X\" and its run carries the grant; a group's duty carries none", () => {
    const base = { roundId: "r1", roundNumber: 3, groupNumber: 2, pilots: [{ entryId: "e1", name: "Bo Marsh" }] };
    expect(dutyText({ ...base, reflightId: "g1" })).toBe("re-flight, round 3, group 2 — pilot Bo Marsh");
    expect(dutyText({ ...base, flyOff: true, reflightId: "g1" })).toBe("re-flight, fly-off round 3, group 2 — pilot Bo Marsh");
    expect(dutyText(base)).toBe("round 3, group 2 — pilots Bo Marsh");
    expect(dutyContest({ ...base, reflightId: "g1" })).toEqual({ roundId: "r1", slots: [{ lane: 0, entryId: "e1" }], reflightId: "g1" });
    expect(dutyContest(base)).toEqual({ roundId: "r1", slots: [{ lane: 0, entryId: "e1" }] });
  });
});
