import { describe, expect, it } from "vitest";
import { getCatalogueTask } from "@/lib/tasks";
import { eventLog } from "../tasks/helpers";
import { due, said } from "./helpers";

const G = getCatalogueTask("G"); // 10 min working time, 30 s landing window (F3K.7)

describe("working-time callouts (worked times, task G, start at 10.000 s)", () => {
  const log = eventLog();
  log.start(10_000);

  it("says the full working time at the start signal", () => {
    const out = due(G, log.events, 9_999, 10_000);
    expect(said(out)).toEqual(["10000 10 minutes"]);
    expect(out[0]).toMatchObject({ id: "wt:min:10", tone: "minute", group: "minutes" });
  });

  it("calls every whole minute left: 7 minutes left at 3:00 elapsed", () => {
    expect(said(due(G, log.events, 189_999, 190_000))).toEqual(["190000 7 minutes"]);
    // The end is at 610.000 s: 1:00 left at 550.000 s, then no mark until the last 10 s.
    expect(said(due(G, log.events, 549_999, 550_000))).toEqual(["550000 1 minute"]);
    expect(said(due(G, log.events, 550_000, 599_999))).toEqual([]);
  });

  it("counts the last 10 s down and marks the end (common practice; F3K.9 asks for a distinct end signal)", () => {
    const out = due(G, log.events, 599_999, 610_000);
    expect(said(out)).toEqual([
      "600000 10", "601000 9", "602000 8", "603000 7", "604000 6",
      "605000 5", "606000 4", "607000 3", "608000 2", "609000 1",
      "610000 End of working time",
    ]);
    expect(out.slice(0, 10).every((c) => c.tone === "tick" && c.group === "lastSeconds")).toBe(true);
    expect(out[10]).toMatchObject({ id: "wt:end", tone: "end", vibratePattern: [400, 120, 400] });
  });

  it("a sweep over the whole window gives 10 minute marks, 10 counts and the end, nothing twice", () => {
    const out = due(G, log.events, 0, 700_000);
    expect(out).toHaveLength(21);
    expect(new Set(out.map((c) => c.id)).size).toBe(21);
  });

  it("nothing before the start signal, and an empty interval says nothing", () => {
    expect(due(G, log.events, 0, 9_999)).toEqual([]);
    expect(due(G, log.events, 190_000, 190_000)).toEqual([]);
  });

  it("a 7-minute variant starts with 7 minutes (task A, 420 s)", () => {
    const A7 = getCatalogueTask("A", 420);
    const l = eventLog();
    l.start(0);
    expect(said(due(A7, l.events, -1, 0))).toEqual(["0 7 minutes"]);
  });
});

describe("landing window (F3K.7: 30 s to land; F3K.9: its last 10 s are counted down)", () => {
  const N = getCatalogueTask("N");

  it("with a model in the air at the end: start, 10 … 1, closed", () => {
    const log = eventLog();
    log.start(0);
    log.launch(500_000);
    const out = due(N, log.events, 600_500, 631_000).filter((c) => c.group === "landingWindow");
    expect(said(out)).toEqual([
      "620000 10", "621000 9", "622000 8", "623000 7", "624000 6",
      "625000 5", "626000 4", "627000 3", "628000 2", "629000 1",
      "630000 Landing window closed",
    ]);
    const atEnd = due(N, log.events, 599_999, 600_000);
    expect(said(atEnd)).toEqual(["600000 End of working time", "600000 Landing window, 30 seconds"]);
  });

  it("with every model down at the end: no landing-window callouts", () => {
    const log = eventLog();
    log.start(0);
    log.flight(500_000, 590_000);
    expect(due(N, log.events, 599_000, 640_000).filter((c) => c.group === "landingWindow")).toEqual([]);
  });

  it("a model that landed inside the landing window stops the countdown", () => {
    const log = eventLog();
    log.start(0);
    log.flight(500_000, 612_000);
    expect(due(N, log.events, 612_000, 640_000).filter((c) => c.group === "landingWindow")).toEqual([]);
  });
});
