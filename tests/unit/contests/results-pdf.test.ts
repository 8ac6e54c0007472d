import { describe, expect, it } from "vitest";
import { resultsPdf } from "@/lib/contests/results-pdf";
import { contestStandings, type StandingsSlot } from "@/lib/contests/standings";
import { getCatalogueTask } from "@/lib/tasks/catalogue";

const A = getCatalogueTask("A");
const slot = (entryId: string, tenths: number, signed = true): StandingsSlot => ({ roundId: "r1", groupNumber: 1, entryId, runResultTenths: tenths, paperFlights: null, signed, penaltyPoints: 0 });

describe("resultsPdf", () => {
  it("writes a PDF with the standings' names and points (jsPDF writes text uncompressed by default)", () => {
    const s = contestStandings({
      rounds: [{ id: "r1", number: 1, isFlyOff: false, task: A }], dropRule: "f3k",
      entries: [{ id: "a", name: "Vera Lindqvist", team: "Marsh Larks", withdrawn: false }, { id: "b", name: "Ōma Test", team: null, withdrawn: false }],
      slots: [slot("a", 3000), slot("b", 2400, false)],
    });
    const pdf = resultsPdf(s, { name: "Reed Cup", day: "2027-05-08", field: "Five Acre Meadow" });
    const text = new TextDecoder("latin1").decode(pdf);
    expect(text.startsWith("%PDF-")).toBe(true);
    expect(text).toContain("(Results: Reed Cup)");
    expect(text).toContain("(Vera Lindqvist)");
    expect(text).toContain("(1000.0)");
    // unsigned: 0.0 marked "u" (F3K.1.2); a name outside Latin-1 is shown with "?" rather than garbled
    expect(text).toContain("(0.0 u)");
    expect(text).toContain("(?ma Test)");
    expect(text).toContain("(1. Marsh Larks: 1000.0 \\(Vera Lindqvist\\))");
  });

  it("marks a round whose two records wait for the officer's decision, as the CSV's Note does", () => {
    const s = contestStandings({
      rounds: [{ id: "r1", number: 1, isFlyOff: false, task: A }], dropRule: "f3k",
      entries: [{ id: "a", name: "Vera Lindqvist", team: null, withdrawn: false }, { id: "b", name: "Noor Halden", team: null, withdrawn: false }],
      slots: [slot("a", 3000), { ...slot("b", 2400), undecided: true }],
    });
    const text = new TextDecoder("latin1").decode(resultsPdf(s, { name: "Reed Cup", day: "2027-05-08", field: "Five Acre Meadow" }));
    // the held record counts meanwhile: 240.0 / 300.0 x 1000 = 800.0 (F3K.9.1)
    expect(text).toContain("(800.0 t)");
    expect(text).toContain("(1000.0)");
    expect(text).toContain("t: two records, not decided yet");
  });
});
