import { describe, expect, it } from "vitest";
import { getCatalogueTask, liveState } from "@/lib/tasks";
import { flightGoal } from "@/lib/callouts";
import { eventLog } from "../tasks/helpers";
import { due, said } from "./helpers";

const targets = (out: ReturnType<typeof due>) => said(out.filter((c) => c.group === "targets"));

describe("target countdowns for the flying pilot", () => {
  it("task G: the 120 s cap (F3K.11, table) is counted to from the launch: 10 to max, 5 … 1, max", () => {
    const G = getCatalogueTask("G");
    const log = eventLog();
    log.start(0);
    log.launch(5_000);
    const out = due(G, log.events, 5_000, 126_000);
    expect(targets(out)).toEqual(["115000 10 to max", "120000 5", "121000 4", "122000 3", "123000 2", "124000 1", "125000 max"]);
    expect(out.find((c) => c.text === "max")).toMatchObject({ tone: "target", lane: 0, id: "target:0:5000:120:0" });
  });

  it("task H: the longest open target that fits between the launch and the end, kept for the whole flight", () => {
    const H = getCatalogueTask("H");
    const log = eventLog();
    log.start(0);
    log.launch(350_000); // 250 s left at the launch: 4:00 fits
    const live = liveState(H, log.events, 500_000); // 100 s left now: the screen's suggestion has moved on
    expect(flightGoal(H, live.lanes[0]!, 350_000, 600_000)).toEqual({ sec: 240, word: "target" });
    expect(targets(due(H, log.events, 589_000, 590_000))).toEqual(["590000 target"]);
  });

  it("task H: after a reached 240 s flight, the next flight counts to 180 s (F3K.11.8 matching)", () => {
    const H = getCatalogueTask("H");
    const log = eventLog();
    log.start(0);
    log.flight(0, 241_000); // 241 s, matched to 240
    log.launch(242_000); // 358 s left: 180 is the longest open target
    expect(targets(due(H, log.events, 411_000, 422_000))).toEqual([
      "412000 10 to target", "417000 5", "418000 4", "419000 3", "420000 2", "421000 1", "422000 target",
    ]);
  });

  it("task K: each flight counts to its own step (60 s, then 90 s; F3K.11 big ladder)", () => {
    const K = getCatalogueTask("K");
    const log = eventLog();
    log.start(0);
    log.launch(1_000);
    expect(targets(due(K, log.events, 60_000, 61_000))).toEqual(["61000 target"]);
    log.land(62_000);
    log.launch(63_000);
    expect(targets(due(K, log.events, 152_000, 153_000))).toEqual(["153000 target"]);
  });

  it("task E: counts to the announced target", () => {
    const E = getCatalogueTask("E");
    const log = eventLog();
    log.start(0);
    log.add(2_000, { kind: "target", lane: 0, targetSec: 45 });
    log.launch(3_000);
    expect(targets(due(E, log.events, 37_000, 48_000))).toEqual([
      "38000 10 to target", "43000 5", "44000 4", "45000 3", "46000 2", "47000 1", "48000 target",
    ]);
  });

  it("no countdown for a flight launched before the working time (it scores zero, F3K.7)", () => {
    const G = getCatalogueTask("G");
    const log = eventLog();
    log.launch(0);
    log.start(2_000);
    expect(targets(due(G, log.events, 0, 200_000))).toEqual([]);
  });

  it("no countdown to a cap that falls after the end of working time (time stops counting there, F3K.7)", () => {
    const G = getCatalogueTask("G");
    const log = eventLog();
    log.start(0);
    log.launch(520_000); // 120 s cap would be at 640 s > 600 s
    expect(targets(due(G, log.events, 520_000, 640_000))).toEqual([]);
  });

  it("several lanes: each callout names its pilot", () => {
    const G = getCatalogueTask("G");
    const log = eventLog();
    log.start(0);
    log.launch(0, 0);
    log.launch(2_000, 1);
    const out = due(G, log.events, 119_500, 122_000, { laneCount: 2, laneNames: ["Ada", "Tobi"] });
    expect(targets(out)).toEqual(["120000 Ada: max", "120000 Tobi: 2", "121000 Tobi: 1", "122000 Tobi: max"]);
  });

  it("an undone and retaken launch is a new flight with new ids", () => {
    const G = getCatalogueTask("G");
    const log = eventLog();
    log.start(0);
    const first = log.launch(1_000);
    const before = due(G, log.events, 1_000, 130_000).filter((c) => c.group === "targets").map((c) => c.id);
    log.add(1_500, { kind: "void", targetId: first });
    log.launch(3_000);
    const after = due(G, log.events, 3_000, 130_000).filter((c) => c.group === "targets").map((c) => c.id);
    expect(after).toHaveLength(7);
    expect(after.some((id) => before.includes(id))).toBe(false);
  });
});

describe("task C (F3K.11: landing window 3:03–3:33 after the signal)", () => {
  it("counts to the 180 s max and through the landing window to the deadline", () => {
    const C = getCatalogueTask("C");
    const log = eventLog();
    log.start(0);
    log.launch(1_000);
    const out = due(C, log.events, 180_000, 214_000);
    expect(said(out)).toEqual([
      "181000 max",
      "183000 Landing window",
      "203000 10", "204000 9", "205000 8", "206000 7", "207000 6",
      "208000 5", "209000 4", "210000 3", "211000 2", "212000 1",
      "213000 Landing window closed",
    ]);
    expect(out.map((c) => c.id)).toContain("c0:lw:end");
  });
});
