import { describe, expect, it } from "vitest";
import { paperCardProblem, paperCardResult, parseFlightTime } from "@/lib/contests/paper-card";
import { getCatalogueTask } from "@/lib/tasks/catalogue";

describe("parseFlightTime", () => {
  it("reads seconds and minutes:seconds to 0.1 s, truncating (F3K.7: never rounded up)", () => {
    expect(parseFlightTime("83.4")).toBe(834);
    expect(parseFlightTime("83,4")).toBe(834);
    expect(parseFlightTime("1:23.4")).toBe(834);
    expect(parseFlightTime("183.96")).toBe(1839);
    expect(parseFlightTime(" 60 ")).toBe(600);
  });
  it("refuses what is not a time", () => {
    for (const bad of ["", "abc", "1:75", "-3", "1.2.3", "99999"]) expect(parseFlightTime(bad)).toBeNull();
  });
});

describe("paperCardResult", () => {
  it("scores a card's flights through the task engine: task A counts the last flight, capped at 300 s", () => {
    expect(paperCardResult(getCatalogueTask("A"), [1200, 1500]).tenths).toBe(1500);
    expect(paperCardResult(getCatalogueTask("A"), [3500]).tenths).toBe(3000);
  });
  it("task D counts two flights; launches beyond its limit are refused", () => {
    const r = paperCardResult(getCatalogueTask("D"), [300, 450, 600]);
    expect(r.tenths).toBe(750);
    expect(r.flights[2]).toMatchObject({ countedTenths: 0, reason: "beyond-launch-limit" });
  });
  it("task C: each flight is its own attempt", () => {
    // three attempts of 100.0, 200.0 and 190.0 s, each capped at 180 s: 100 + 180 + 180 = 460.0 s
    expect(paperCardResult(getCatalogueTask("C"), [1000, 2000, 1900]).tenths).toBe(4600);
  });
  it("task E is refused with a reason (no targets on the card)", () => {
    expect(paperCardProblem(getCatalogueTask("E"))).toMatch(/task E/);
    expect(paperCardProblem(getCatalogueTask("A"))).toBeNull();
  });
});
