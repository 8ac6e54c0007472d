import { describe, expect, it } from "vitest";
import { deriveRun } from "@/lib/sync/derive";
import { getCatalogueTask, scoreTask } from "@/lib/tasks";
import { backToBack } from "../tasks/helpers";
import { device, estimatesOf } from "./helpers";

const H = getCatalogueTask("H");
const PILOT = "pilot-user";
const KEEPER = "timekeeper-user";
const solo = [{ lane: 0, pilotUserId: PILOT }];
/** A run the pilot set up themselves; no contest assigned anyone. */
const own = { createdBy: PILOT, officials: new Set<string>() };
/** A run a club mate (KEEPER) set up and timed for the pilot; no contest assigned anyone. */
const byMate = { createdBy: KEEPER, officials: new Set<string>() };
/** A contest run: KEEPER is its assigned timekeeper. */
const contest = (...officials: string[]) => ({ createdBy: KEEPER, officials: new Set(officials) });

describe("deriveRun: one device", () => {
  it("F3K.11.8 task H: flights 63, 239, 182, 90 → 569 s, the same as scoreTask", () => {
    const phone = device("phone", PILOT);
    phone.at(0, { kind: "window-start" });
    phone.flights(0, [63, 239, 182, 90], 1000);
    const [lane] = deriveRun({ ...own, task: H, lanes: solo, events: phone.events, estimatesByDevice: estimatesOf(phone) });
    // RULES.md, F3K.11.8 example: 60 + 239 + 180 + 90 = 569 s
    expect(lane!.resultTenths).toBe(5690);
    expect(lane!.resultTenths).toBe(scoreTask({ task: "H", flights: backToBack([63, 239, 182, 90], 1000, 1000) }).tenths);
    expect(lane!.needsReview).toBe(false);
    expect(lane!.derived.flights.map((f) => f.creditedTenths)).toEqual([600, 2390, 1800, 900]);
    expect(lane!.derived.breakdown?.scoredTenths).toBe(5690);
    expect(lane!.derived.versions).toHaveLength(1);
  });

  it("a lane nobody recorded has no result (null, not zero)", () => {
    const phone = device("phone", PILOT);
    phone.at(0, { kind: "window-start" });
    phone.flights(0, [100], 1000);
    const lanes = [{ lane: 0, pilotUserId: PILOT }, { lane: 1, pilotUserId: null }];
    const [, empty] = deriveRun({ ...own, task: H, lanes, events: phone.events, estimatesByDevice: estimatesOf(phone) });
    expect(empty!.resultTenths).toBeNull();
    expect(empty!.derived.versions).toEqual([]);
  });

  it("a correction moves a landing on the target device's clock, put on the server timeline", () => {
    // the phone runs 10 min slow: server = device wall + 600 000 ms
    const phone = device("phone", PILOT, { thetaMs: 600_000 });
    phone.at(0, { kind: "window-start" });
    phone.at(1000, { kind: "launch", lane: 0 });
    const landing = phone.at(101_000, { kind: "landing", lane: 0 }); // 100 s
    // corrected to a device wall time 20 s earlier → an 80 s flight
    phone.at(120_000, { kind: "correct", targetId: landing.id, wallMs: landing.stamp.wallMs - 20_000 });
    const [lane] = deriveRun({ ...own, task: H, lanes: solo, events: phone.events, estimatesByDevice: estimatesOf(phone) });
    expect(lane!.derived.flights[0]!.timeTenths).toBe(800);
  });
});

describe("deriveRun: conflict rules (SYNC.md §3)", () => {
  it("an assigned timekeeper's record is official and beats the pilot's own; both stay as versions", () => {
    const keeper = device("keeper-phone", KEEPER);
    const self = device("pilot-phone", PILOT);
    keeper.at(0, { kind: "window-start" });
    keeper.flights(0, [60, 120], 1000);
    self.flights(0, [62, 125], 900); // the pilot started earlier — precedence still goes to the official
    const [lane] = deriveRun({ ...contest(KEEPER), task: H, lanes: solo, events: [...self.events, ...keeper.events], estimatesByDevice: estimatesOf(keeper, self) });
    expect(lane!.derived.source).toEqual({ deviceId: "keeper-phone", official: true });
    expect(lane!.resultTenths).toBe(1800);
    expect(lane!.derived.versions.map((v) => [v.deviceId, v.official, v.chosen, v.resultTenths])).toEqual([
      ["keeper-phone", true, true, 1800],
      ["pilot-phone", false, false, 62 * 10 + 125 * 10],
    ]);
  });

  it("a club mate who timed the pilot is not official, and the pilot's own record goes first", () => {
    const mate = device("mate-phone", KEEPER);
    const self = device("pilot-phone", PILOT);
    mate.at(0, { kind: "window-start" });
    mate.flights(0, [60, 120], 800); // earlier than the pilot's own taps: time order alone would pick it
    self.flights(0, [62, 125], 900);
    const [lane] = deriveRun({ ...byMate, task: H, lanes: solo, events: [...mate.events, ...self.events], estimatesByDevice: estimatesOf(mate, self) });
    expect(lane!.derived.source).toEqual({ deviceId: "pilot-phone", official: false });
    expect(lane!.derived.versions.map((v) => [v.deviceId, v.official, v.chosen])).toEqual([
      ["pilot-phone", false, true],
      ["mate-phone", false, false],
    ]);
    expect(lane!.derived.signal?.official).toBe(false);
  });

  it("between two officials the earlier corrected first event wins, whatever the phones' own clocks say", () => {
    // b's wall clock reads 5 min ahead (θ = −300 s): its raw times look later than a's, its corrected ones are earlier
    const a = device("a-phone", "official-a");
    const b = device("b-phone", "official-b", { thetaMs: -300_000 });
    a.at(0, { kind: "window-start" });
    b.flights(0, [50], 1000);
    a.flights(0, [55], 1200);
    expect(b.events[0]!.stamp.wallMs).toBeGreaterThan(a.events[1]!.stamp.wallMs);
    const [lane] = deriveRun({ ...contest("official-a", "official-b"), task: H, lanes: solo, events: [...a.events, ...b.events], estimatesByDevice: estimatesOf(a, b) });
    expect(lane!.derived.source?.deviceId).toBe("b-phone");
    expect(lane!.resultTenths).toBe(500);
  });

  it("between two club mates (neither official nor the pilot) the earlier corrected record wins", () => {
    const a = device("a-phone", "mate-a");
    const b = device("b-phone", "mate-b");
    a.at(0, { kind: "window-start" });
    a.flights(0, [55], 1200);
    b.flights(0, [50], 1000);
    const [lane] = deriveRun({ ...byMate, task: H, lanes: solo, events: [...a.events, ...b.events], estimatesByDevice: estimatesOf(a, b) });
    expect(lane!.derived.source).toEqual({ deviceId: "b-phone", official: false });
  });

  it("a tie on precedence and time goes to the smaller device id", () => {
    const z = device("z-phone", "mate-z");
    const a = device("a-phone", "mate-a");
    z.at(0, { kind: "window-start" });
    z.flights(0, [70], 1000);
    a.flights(0, [40], 1000);
    const [lane] = deriveRun({ ...byMate, task: H, lanes: solo, events: [...z.events, ...a.events], estimatesByDevice: estimatesOf(z, a) });
    expect(lane!.derived.source?.deviceId).toBe("a-phone");
    expect(lane!.resultTenths).toBe(400);
  });

  it("a record its device undid entirely is not a candidate", () => {
    const keeper = device("keeper-phone", KEEPER);
    const self = device("pilot-phone", PILOT);
    keeper.at(0, { kind: "window-start" });
    const launch = keeper.at(1000, { kind: "launch", lane: 0 });
    keeper.at(1500, { kind: "void", targetId: launch.id });
    self.flights(0, [90], 2000);
    const [lane] = deriveRun({ ...contest(KEEPER), task: H, lanes: solo, events: [...keeper.events, ...self.events], estimatesByDevice: estimatesOf(keeper, self) });
    expect(lane!.derived.source?.deviceId).toBe("pilot-phone");
    expect(lane!.resultTenths).toBe(900);
  });

  it("the run's signal comes from an official over a pilot's own start tap", () => {
    const keeper = device("keeper-phone", KEEPER);
    const self = device("pilot-phone", PILOT);
    self.at(-5000, { kind: "window-start" }); // the pilot's own early start
    keeper.at(0, { kind: "window-start" });
    self.flights(0, [60], -2000); // launched 2 s before the official signal: scores zero
    const [lane] = deriveRun({ ...contest(KEEPER), task: H, lanes: solo, events: [...self.events, ...keeper.events], estimatesByDevice: estimatesOf(keeper, self) });
    expect(lane!.derived.signal?.deviceId).toBe("keeper-phone");
    expect(lane!.derived.flights[0]!.reason).toBe("launched-before-working-time");
    expect(lane!.resultTenths).toBe(0);
    expect(lane!.needsReview).toBe(false); // 2 s is far outside the ±40 ms the clocks allow
  });

  it("with no official, the signal of the run's creator goes before a lane pilot's earlier start tap", () => {
    const keeper = device("keeper-phone", KEEPER);
    const self = device("pilot-phone", PILOT);
    self.at(-5000, { kind: "window-start" });
    keeper.at(0, { kind: "window-start" });
    self.flights(0, [60], 1000);
    const [lane] = deriveRun({ ...byMate, task: H, lanes: solo, events: [...self.events, ...keeper.events], estimatesByDevice: estimatesOf(keeper, self) });
    expect(lane!.derived.signal).toMatchObject({ deviceId: "keeper-phone", official: false });
  });
});

describe("deriveRun: penalties are rulings, not timing records", () => {
  const DIRECTOR = "field-director";

  it("a penalty from an official's phone that timed nothing applies to the chosen record and never replaces it", () => {
    const self = device("pilot-phone", PILOT);
    const director = device("director-phone", DIRECTOR);
    self.at(0, { kind: "window-start" });
    self.flights(0, [60, 120], 1000);
    director.at(200_000, { kind: "penalty", lane: 0, points: 100, reason: "Landed in the safety area" });
    const [lane] = deriveRun({ ...contest(DIRECTOR), task: H, lanes: solo, events: [...self.events, ...director.events], estimatesByDevice: estimatesOf(self, director) });
    // Official over self-timing must not hand the lane to a phone with no flights on it.
    expect(lane!.derived.source?.deviceId).toBe("pilot-phone");
    expect(lane!.resultTenths).toBe(1800);
    expect(lane!.penaltyPoints).toBe(100);
    expect(lane!.derived.versions.map((v) => v.deviceId)).toEqual(["pilot-phone"]);
    expect(lane!.derived.notes).toEqual([]);
  });

  it("an invalid mark from an official's phone that timed nothing zeroes that flight of the chosen record (F3K.6.2)", () => {
    const self = device("pilot-phone", PILOT);
    const director = device("director-phone", DIRECTOR);
    self.at(0, { kind: "window-start" });
    self.flights(0, [60, 120], 1000);
    director.at(200_000, { kind: "invalid", lane: 0, flightIndex: 1, reason: "landing-outside-field" });
    const [lane] = deriveRun({ ...contest(DIRECTOR), task: H, lanes: solo, events: [...self.events, ...director.events], estimatesByDevice: estimatesOf(self, director) });
    expect(lane!.derived.source?.deviceId).toBe("pilot-phone");
    expect(lane!.derived.flights.map((f) => f.creditedTenths)).toEqual([600, 0]);
    expect(lane!.resultTenths).toBe(600);
  });

  it("an undone ruling counts nothing; the pilot cannot give a ruling from a second phone of their own", () => {
    const keeper = device("keeper-phone", KEEPER);
    const director = device("director-phone", DIRECTOR);
    const spare = device("pilot-spare", PILOT);
    keeper.at(0, { kind: "window-start" });
    keeper.flights(0, [60], 1000);
    const ruling = director.at(100_000, { kind: "penalty", lane: 0, points: 100, reason: "Wrong field" });
    director.at(101_000, { kind: "void", targetId: ruling.id });
    spare.at(102_000, { kind: "penalty", lane: 0, points: 300, reason: "Self-reported" });
    const events = [...keeper.events, ...director.events, ...spare.events];
    const [lane] = deriveRun({ ...contest(KEEPER, DIRECTOR), task: H, lanes: solo, events, estimatesByDevice: estimatesOf(keeper, director, spare) });
    expect(lane!.derived.source?.deviceId).toBe("keeper-phone");
    expect(lane!.penaltyPoints).toBe(0);
    expect(lane!.derived.notes?.map((n) => [n.deviceId, n.points])).toEqual([["pilot-spare", 300]]);
  });

  it("a penalty on a phone that also timed the lane stays with that record only: one ruling is not counted twice", () => {
    const keeper = device("keeper-phone", KEEPER);
    const second = device("second-keeper", "other-keeper");
    keeper.at(0, { kind: "window-start" });
    keeper.flights(0, [60], 1000);
    keeper.at(70_000, { kind: "penalty", lane: 0, points: 100, reason: "Launched outside the launch area" });
    second.flights(0, [61], 1200);
    second.at(70_500, { kind: "penalty", lane: 0, points: 100, reason: "Launched outside the launch area" });
    const events = [...keeper.events, ...second.events];
    const [lane] = deriveRun({ ...contest(KEEPER, "other-keeper"), task: H, lanes: solo, events, estimatesByDevice: estimatesOf(keeper, second) });
    expect(lane!.derived.source?.deviceId).toBe("keeper-phone");
    expect(lane!.penaltyPoints).toBe(100);
  });

  it("a club mate's 1,000-point penalty on the run they timed is not official and is kept as a note, not applied", () => {
    const mate = device("mate-phone", KEEPER);
    mate.at(0, { kind: "window-start" });
    mate.flights(0, [60, 120], 1000);
    mate.at(200_000, { kind: "penalty", lane: 0, points: 1000, reason: "Because I can" });
    mate.at(201_000, { kind: "invalid", lane: 0, flightIndex: 1, reason: "other" });
    const [lane] = deriveRun({ ...byMate, task: H, lanes: solo, events: mate.events, estimatesByDevice: estimatesOf(mate) });
    expect(lane!.derived.source).toEqual({ deviceId: "mate-phone", official: false });
    expect(lane!.derived.versions[0]?.official).toBe(false);
    expect(lane!.penaltyPoints).toBe(0);
    expect(lane!.resultTenths).toBe(1800); // the invalid mark is not applied either
    expect(lane!.derived.notes?.map((n) => [n.kind, n.recordedBy, n.points, n.flightIndex])).toEqual([
      ["penalty", KEEPER, 1000, null],
      ["invalid", KEEPER, null, 1],
    ]);
  });

  it("a club mate's \"not signed\" and re-flight in practice are not applied but kept as notes, not dropped (ours; F3K.1.2 and F3K.9.6 are contest rulings)", () => {
    const mate = device("mate-phone", KEEPER);
    mate.at(0, { kind: "window-start" });
    mate.flights(0, [60, 120], 1000);
    mate.at(200_000, { kind: "unsigned", lane: 0 });
    mate.at(201_000, { kind: "reflight", lane: 0, cause: "rain", placement: "later-group", reason: "Shower" });
    const [lane] = deriveRun({ ...byMate, task: H, lanes: solo, events: mate.events, estimatesByDevice: estimatesOf(mate) });
    expect(lane!.resultTenths).toBe(1800); // the round is not zeroed: only an official's or the pilot's own ruling counts
    expect(lane!.derived.notes?.map((n) => [n.kind, n.recordedBy, n.reflight ?? null, n.reason])).toEqual([
      ["unsigned", KEEPER, null, ""],
      ["reflight", KEEPER, { cause: "rain", placement: "later-group" }, "Shower"],
    ]);
  });

  it("a club mate's penalty from a phone that timed nothing is a note too", () => {
    const self = device("pilot-phone", PILOT);
    const mate = device("mate-phone", KEEPER);
    self.at(0, { kind: "window-start" });
    self.flights(0, [60], 1000);
    mate.at(100_000, { kind: "penalty", lane: 0, points: 1000, reason: "Prank" });
    const [lane] = deriveRun({ ...own, task: H, lanes: solo, events: [...self.events, ...mate.events], estimatesByDevice: estimatesOf(self, mate) });
    expect(lane!.penaltyPoints).toBe(0);
    expect(lane!.derived.notes?.map((n) => n.points)).toEqual([1000]);
  });

  it("the pilot's own penalty and invalid mark in the record they timed count", () => {
    const self = device("pilot-phone", PILOT);
    self.at(0, { kind: "window-start" });
    self.flights(0, [60, 120], 1000);
    self.at(200_000, { kind: "penalty", lane: 0, points: 100, reason: "Launched outside the launch area" });
    self.at(201_000, { kind: "invalid", lane: 0, flightIndex: 1, reason: "landing-outside-field" });
    const [lane] = deriveRun({ ...own, task: H, lanes: solo, events: self.events, estimatesByDevice: estimatesOf(self) });
    expect(lane!.penaltyPoints).toBe(100);
    expect(lane!.resultTenths).toBe(600);
    expect(lane!.derived.notes).toEqual([]);
  });
});

describe("deriveRun: a phone whose wall clock jumped during the run", () => {
  it("takes the flight's duration from the phone's steady clock and flags the lane with both times", () => {
    const phone = device("phone", PILOT);
    phone.at(0, { kind: "window-start" });
    const launch = phone.at(1000, { kind: "launch", lane: 0 });
    const landing = phone.at(570_500, { kind: "landing", lane: 0 }); // 569.5 s on the steady clock
    // ... but the wall clock was stepped back 532.3 s during the flight
    landing.stamp = { ...landing.stamp, wallMs: launch.stamp.wallMs + 37_200 };
    const N = getCatalogueTask("N");
    const [lane] = deriveRun({ ...own, task: N, lanes: solo, events: phone.events, estimatesByDevice: estimatesOf(phone) });
    // Task N: the best flight counts up to 599 s (RULES.md F3K.11 table).
    expect(lane!.resultTenths).toBe(5695);
    expect(lane!.needsReview).toBe(true);
    expect(lane!.reviewReason).toContain("569.5 s by the phone's steady clock, 37.2 s by its wall clock");
  });
});
