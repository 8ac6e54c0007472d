import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { resultsCsv } from "@/lib/contests/results-csv";
import { resultsPdf } from "@/lib/contests/results-pdf";
import { contestStandings, type StandingsReflight, type StandingsSlot } from "@/lib/contests/standings";
import { getCatalogueTask } from "@/lib/tasks/catalogue";

/**
 * The CSV and the PDF say, for a re-flown round, both results and which one counted (F3K.9.6), and
 * mark a result under an open dispute. Numbers by hand: task A (last flight), group normalisation
 * best = 1000 (F3K.9.1).
 */
const A = getCatalogueTask("A");
const entries = ["P1", "P2", "P3"].map((id, i) => ({ id, name: ["Nell Arden", "Otto Brisk", "Pia Colm"][i]!, team: null, withdrawn: false }));
const slot = (entryId: string, tenths: number, extra: Partial<StandingsSlot> = {}): StandingsSlot => ({
  roundId: "r1", groupNumber: 1, entryId, runResultTenths: tenths, paperFlights: null, signed: true, penaltyPoints: 0, ...extra,
});
const again = (r: Partial<StandingsReflight>): StandingsReflight => ({ placement: "later-group", entitled: true, groupNumber: 1, runResultTenths: null, paperFlights: null, signed: true, ...r });
// Group 1: Nell 150.0 s, re-flown in a later group with the original group's number kept for simplicity: 180.0 s, better → the re-flight counts (F3K.9.6, later group: the better stands).
// Otto 200.0 s, re-flown with the original group: 120.0 s stands even if worse (F3K.9.6).
// Pia 160.0 s with an open dispute. Points: best 180.0 → Nell 1000.0, Otto 120/180 = 666.7, Pia 160/180 = 888.9.
const standings = contestStandings({
  rounds: [{ id: "r1", number: 1, isFlyOff: false, task: A }], entries, dropRule: "f3k",
  slots: [
    slot("P1", 1500, { reflight: again({ runResultTenths: 1800 }) }),
    slot("P2", 2000, { reflight: again({ placement: "original-group", runResultTenths: 1200 }) }),
    slot("P3", 1600, { disputed: true }),
  ],
});

describe("results marks: re-flights (F3K.9.6) and disputes", () => {
  it("the CSV's Re-flights column gives both results and which counted; the Note marks a disputed result", () => {
    const rows = Papa.parse<Record<string, string>>(resultsCsv(standings), { header: true, skipEmptyLines: true }).data;
    const row = (name: string) => rows.find((r) => r.Pilot === name)!;
    expect(row("Nell Arden")["Round 1 (A)"]).toBe("1000.0");
    expect(row("Nell Arden")["Re-flights"]).toBe("round 1: original 150.0 s, re-flight 180.0 s: re-flight counted");
    expect(row("Otto Brisk")["Round 1 (A)"]).toBe("666.7");
    expect(row("Otto Brisk")["Re-flights"]).toBe("round 1: original 200.0 s, re-flight 120.0 s: re-flight counted");
    expect(row("Pia Colm")["Re-flights"]).toBe("");
    expect(row("Pia Colm").Note).toBe("round 1 result under dispute");
    expect(row("Nell Arden").Note).toBe("");
  });

  it("a later-group re-flight that is worse: the original counted (F3K.9.6)", () => {
    const s = contestStandings({
      rounds: [{ id: "r1", number: 1, isFlyOff: false, task: A }], entries: entries.slice(0, 2), dropRule: "f3k",
      slots: [slot("P1", 1500, { reflight: again({ runResultTenths: 900 }) }), slot("P2", 2000)],
    });
    const rows = Papa.parse<Record<string, string>>(resultsCsv(s), { header: true, skipEmptyLines: true }).data;
    // 150/200 = 750.0
    expect(rows.find((r) => r.Pilot === "Nell Arden")).toMatchObject({ "Round 1 (A)": "750.0", "Re-flights": "round 1: original 150.0 s, re-flight 90.0 s: original counted" });
  });

  it("the PDF marks re-flown cells 'r' and disputed ones 'd', and lists which result counted (jsPDF writes text uncompressed)", () => {
    const text = new TextDecoder("latin1").decode(resultsPdf(standings, { name: "Reed Cup", day: "2027-05-08", field: "Five Acre Meadow" }));
    expect(text).toContain("(1000.0 r)");
    expect(text).toContain("(666.7 r)");
    expect(text).toContain("(888.9 d)");
    expect(text).toContain("(Re-flights \\(F3K.9.6\\): which result counted)");
    expect(text).toContain("(Nell Arden, round 1: original 150.0 s, re-flight 180.0 s: re-flight counted)");
    expect(text).toContain("(Otto Brisk, round 1: original 200.0 s, re-flight 120.0 s: re-flight counted)");
  });
});
