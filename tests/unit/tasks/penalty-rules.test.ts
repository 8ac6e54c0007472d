import { describe, expect, it } from "vitest";
import { eventBodySchema } from "@/lib/events/schema";
import { foldRun, getCatalogueTask, pointsLost } from "@/lib/tasks";
import { applyPenaltyRules } from "@/lib/tasks/penalty-rules";
import { eventLog } from "./helpers";

const G = getCatalogueTask("G");

/** One lane: a 60 s and a 50 s flight, returning the two launch ids. */
function twoFlights() {
  const log = eventLog();
  log.start(0);
  const first = log.launch(1000);
  log.land(61_000);
  const second = log.launch(62_000);
  log.land(112_000);
  return { log, first, second };
}

describe("penalties in one attempt (RULES.md Penalties)", () => {
  it("F3K.4.3: several penalties in one attempt → only the highest counts", () => {
    const { log, first } = twoFlights();
    log.add(70_000, { kind: "penalty", lane: 0, points: 100, reason: "touched the ground in the safety area", cause: "object-in-safety-area", launchId: first });
    log.add(71_000, { kind: "penalty", lane: 0, points: 300, reason: "touched a helper in the safety area", cause: "person-in-safety-area", launchId: first });
    const lane = foldRun(G, log.events).lanes[0]!;
    expect(lane.penaltyPoints).toBe(300);
    expect(lane.penalties.map((p) => [p.points, p.applied, p.dropped])).toEqual([
      [100, false, "higher-in-same-attempt"],
      [300, true, null],
    ]);
  });
  it("F3K.4.3: penalties in different attempts each count", () => {
    const { log, first, second } = twoFlights();
    log.add(70_000, { kind: "penalty", lane: 0, points: 100, reason: "a", cause: "object-in-safety-area", launchId: first });
    log.add(120_000, { kind: "penalty", lane: 0, points: 100, reason: "b", cause: "object-in-safety-area", launchId: second });
    expect(foldRun(G, log.events).lanes[0]!.penaltyPoints).toBe(200);
  });
  it("F3K.4.3: no penalty when the contact came from a mid-air collision", () => {
    const { log, first } = twoFlights();
    log.add(70_000, { kind: "penalty", lane: 0, points: 100, reason: "fell into the safety area after a collision", cause: "object-in-safety-area", launchId: first, midAir: true });
    const lane = foldRun(G, log.events).lanes[0]!;
    expect(lane.penaltyPoints).toBe(0);
    expect(lane.penalties[0]).toMatchObject({ applied: false, dropped: "mid-air-collision" });
  });
  it("F3K.4.3: a mid-air penalty does not hide a lower one of the same attempt", () => {
    expect(
      applyPenaltyRules([
        { id: "a", points: 300, reason: "x", launchId: "L", midAir: true },
        { id: "b", points: 100, reason: "y", launchId: "L" },
      ]).points,
    ).toBe(100);
  });
  it("F3K.4.1: a contact with a person at launch zeroes the round, plus the penalty", () => {
    const { log, first } = twoFlights();
    log.add(2000, { kind: "penalty", lane: 0, points: 300, reason: "hit a bystander at launch", cause: "launch-contact", launchId: first });
    const lane = foldRun(G, log.events).lanes[0]!;
    // 60.0 + 50.0 s flown, all taken by the ruling; the 300 points stay.
    expect(lane.resultTenths).toBe(0);
    expect(lane.zeroedTenths).toBe(1100);
    expect(lane.roundZero).toBe("launch-contact");
    expect(lane.penaltyPoints).toBe(300);
  });
  it("F3K.4.1: the round is zeroed even when a higher penalty of the same attempt takes the points", () => {
    const out = applyPenaltyRules([
      { id: "a", points: 100, reason: "x", launchId: "L", cause: "launch-contact" },
      { id: "b", points: 300, reason: "y", launchId: "L", cause: "person-in-safety-area" },
    ]);
    expect([out.points, out.zeroesRound]).toEqual([300, true]);
  });
  it("F3K.1.2: a round result not signed by pilot and timekeeper scores zero", () => {
    const { log } = twoFlights();
    log.add(130_000, { kind: "unsigned", lane: 0 });
    const lane = foldRun(G, log.events).lanes[0]!;
    expect([lane.resultTenths, lane.roundZero, lane.penaltyPoints]).toEqual([0, "unsigned", 0]);
  });
  it("F3K.1.2: undoing the not-signed ruling restores the result", () => {
    const { log } = twoFlights();
    const ruling = log.add(130_000, { kind: "unsigned", lane: 0 });
    log.add(131_000, { kind: "void", targetId: ruling });
    expect(foldRun(G, log.events).lanes[0]!.resultTenths).toBe(1100);
  });
  it("ours: penalties tied to no attempt (recorded before attempts were) each count in full", () => {
    const { log } = twoFlights();
    log.add(70_000, { kind: "penalty", lane: 0, points: 100, reason: "a" });
    log.add(71_000, { kind: "penalty", lane: 0, points: 100, reason: "b" });
    expect(foldRun(G, log.events).lanes[0]!.penaltyPoints).toBe(200);
  });
  it("ours: the points lost show the zeroed result as its own cause and still add up", () => {
    const { log } = twoFlights();
    log.add(130_000, { kind: "unsigned", lane: 0 });
    const lost = pointsLost(G, foldRun(G, log.events).lanes[0]!);
    // G in 10 min can score at most 595 s (5 × 120 s against the F3K.7 sum cap 600 − 5).
    expect(lost.lostTenths).toBe(5950);
    expect(lost.parts.roundZero).toBe(1100);
    expect(Object.values(lost.parts).reduce((a, b) => a + b, 0)).toBe(5950);
  });
});

describe("the penalty event on the wire", () => {
  it("takes a cause, the attempt's launch id and a mid-air flag; refuses an unknown cause", () => {
    const base = { kind: "penalty", lane: 0, points: 100, reason: "r" };
    expect(eventBodySchema.safeParse({ ...base, cause: "launch-contact", launchId: "00000000-0000-7000-8000-000000000001", midAir: false }).success).toBe(true);
    expect(eventBodySchema.safeParse(base).success).toBe(true);
    expect(eventBodySchema.safeParse({ ...base, cause: "bribery" }).success).toBe(false);
    expect(eventBodySchema.safeParse({ ...base, launchId: "flight 2" }).success).toBe(false);
  });
  it("a not-signed ruling and a re-flight name a lane 0–3; a re-flight names its cause and placement", () => {
    expect(eventBodySchema.safeParse({ kind: "unsigned", lane: 4 }).success).toBe(false);
    expect(eventBodySchema.safeParse({ kind: "reflight", lane: 1, cause: "rain", placement: "later-group" }).success).toBe(true);
    expect(eventBodySchema.safeParse({ kind: "reflight", lane: 1, cause: "rain", placement: "tomorrow" }).success).toBe(false);
    expect(eventBodySchema.safeParse({ kind: "reflight", lane: 1, cause: "rain", placement: "new-group", reason: "x".repeat(201) }).success).toBe(false);
  });
});

describe("re-flights on the run (F3K.9.6)", () => {
  it("a granted re-flight is carried on the lane with its cause and placement, and undo removes it", () => {
    const { log } = twoFlights();
    const grant = log.add(130_000, { kind: "reflight", lane: 0, cause: "launch-collision", placement: "later-group", reason: "hit at launch by lane 2's model" });
    const lane = foldRun(G, log.events).lanes[0]!;
    expect(lane.reflights).toEqual([{ id: grant, cause: "launch-collision", placement: "later-group", reason: "hit at launch by lane 2's model" }]);
    // The first flight's result is still shown: which one stands is settled when both are known.
    expect(lane.resultTenths).toBe(1100);
    log.add(131_000, { kind: "void", targetId: grant });
    expect(foldRun(G, log.events).lanes[0]!.reflights).toEqual([]);
  });
});
