import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { resultsCsv } from "@/lib/contests/results-csv";
import { contestStandings, type StandingsSlot } from "@/lib/contests/standings";
import { getCatalogueTask } from "@/lib/tasks/catalogue";

/**
 * A round with two records (a slot's or its re-flight's) that the officer has not decided between:
 * the standings count the record held now, unchanged, and mark the cell undecided; the CSV's Note says
 * so. Numbers by hand: task A (last flight), group normalisation best = 1000 (F3K.9.1).
 */
const A = getCatalogueTask("A");
const entries = ["P1", "P2"].map((id, i) => ({ id, name: ["Nell Arden", "Otto Brisk"][i]!, team: null, withdrawn: false }));
const slot = (entryId: string, tenths: number, extra: Partial<StandingsSlot> = {}): StandingsSlot => ({
  roundId: "r1", groupNumber: 1, entryId, runResultTenths: tenths, paperFlights: null, signed: true, penaltyPoints: 0, ...extra,
});

describe("records not decided yet", () => {
  const s = contestStandings({
    rounds: [{ id: "r1", number: 1, isFlyOff: false, task: A }], entries, dropRule: "f3k",
    slots: [slot("P1", 1500, { undecided: true }), slot("P2", 2000)],
  });

  it("mark the cell, and count the record held now (150/200 = 750.0)", () => {
    const nell = s.pilots.find((p) => p.name === "Nell Arden")!.rounds[0]!;
    expect(nell).toMatchObject({ undecided: true, pointsTenths: 7500 });
    expect(s.pilots.find((p) => p.name === "Otto Brisk")!.rounds[0]!.undecided).toBe(false);
  });

  it("the CSV's Note says which round waits for a decision", () => {
    const rows = Papa.parse<Record<string, string>>(resultsCsv(s), { header: true, skipEmptyLines: true }).data;
    expect(rows.find((r) => r.Pilot === "Nell Arden")!.Note).toBe("round 1 two records, not decided yet");
    expect(rows.find((r) => r.Pilot === "Otto Brisk")!.Note).toBe("");
  });
});
