import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import type { ContestPenalty } from "@/lib/contests/penalties";
import { penaltiesCsv } from "@/lib/contests/results-csv";
import { resultsPdf } from "@/lib/contests/results-pdf";
import { contestStandings } from "@/lib/contests/standings";
import { getCatalogueTask } from "@/lib/tasks/catalogue";

/** Each penalty in the penalties CSV and the PDF's list: cause with its rule (RULES.md "Penalties"), who and when on the club's clock, a removal. */
const given = Date.parse("2027-05-08T12:05:00Z"); // Europe/Helsinki keeps summer time (UTC+3) in May: 15:05 on the club's clock (from memory of the zone rules)
const officer: ContestPenalty = {
  id: "p1", roundNumber: 2, isFlyOff: false, entryId: "a", name: "Vera Lindqvist", source: "officer", points: 300, cause: "person-in-safety-area", reason: "=HYPERLINK(1)",
  applied: false, dropped: null, givenBy: "Ines Varga", givenAtMs: given, removedBy: "Ola Brand", removedAtMs: given + 600_000, removedReason: "Her own helper", eventId: null,
};
const phone: ContestPenalty = {
  id: null, roundNumber: 1, isFlyOff: true, entryId: "b", name: "Tam Ossory", source: "phone", points: 100, cause: "outside-time", reason: "Early launch",
  applied: true, dropped: null, givenBy: "Kit Rowe", givenAtMs: given, removedBy: null, removedAtMs: null, removedReason: null, eventId: "00000000-0000-7000-8000-000000000001",
};
/** A phone's penalty an officer set aside on the round page (db/queries/contest-phone-set-aside.ts). */
const setAside: ContestPenalty = {
  ...phone, isFlyOff: false, roundNumber: 3, points: 300, cause: "person-in-safety-area", reason: "Touched a helper", applied: false,
  removedBy: "Ola Brand", removedAtMs: given + 1_200_000, removedReason: "It was the pilot's own helper", eventId: "00000000-0000-7000-8000-000000000002",
};

describe("penaltiesCsv", () => {
  it("one row each, times on the club's clock (Europe/Helsinki in May is UTC+3: 15:05), a removal's who/when/why, formulas escaped", () => {
    const rows = Papa.parse<Record<string, string>>(penaltiesCsv([officer, phone], "Europe/Helsinki"), { header: true, skipEmptyLines: true }).data;
    expect(rows[0]).toMatchObject({
      Round: "2", Pilot: "Vera Lindqvist", Points: "300", Cause: "Model touched a person in a safety area (F3K.4.3)", Note: "'=HYPERLINK(1)", Given: "given on the round page",
      "Given by": "Ines Varga", Counts: "no: removed", "Removed by": "Ola Brand", "Why removed": "Her own helper",
    });
    expect(rows[0]!["Given at"]).toContain("15:05");
    expect(rows[0]!["Removed at"]).toContain("15:15");
    expect(rows[1]).toMatchObject({ Round: "Fly-off 1", Given: "given on the timekeeper's phone", "Given by": "Kit Rowe", Counts: "yes", "Removed by": "" });
  });

  it("a phone's penalty an officer set aside: not counting, \"set aside\", with the officer, when on the club's clock and why", () => {
    const [row] = Papa.parse<Record<string, string>>(penaltiesCsv([setAside], "Europe/Helsinki"), { header: true, skipEmptyLines: true }).data;
    expect(row).toMatchObject({
      Round: "3", Points: "300", Given: "given on the timekeeper's phone", "Given by": "Kit Rowe", Counts: "no: set aside",
      "Removed by": "Ola Brand", "Why removed": "It was the pilot's own helper",
    });
    expect(row!["Removed at"]).toContain("15:25");
  });
});

describe("resultsPdf's penalty list", () => {
  const s = contestStandings({ rounds: [{ id: "r1", number: 1, isFlyOff: false, task: getCatalogueTask("A") }], dropRule: "f3k", entries: [], slots: [] });
  it("lists each penalty with who and when for members, without them through the public link", () => {
    const members = new TextDecoder("latin1").decode(resultsPdf(s, { name: "Reed Cup", day: "2027-05-08", field: "Meadow" }, { list: [phone], zone: "Europe/Helsinki", withWho: true }));
    // jsPDF escapes the brackets of a PDF string; a long line may wrap, so the parts are checked apart
    expect(members).toContain("Fly-off round 1, Tam Ossory: -100, Launched or flew outside the group's times \\(F3K.9.5\\) \"Early launch\"");
    expect(members).toContain("given on the timekeeper's phone by Kit Rowe");
    const outside = new TextDecoder("latin1").decode(resultsPdf(s, { name: "Reed Cup", day: "2027-05-08", field: "Meadow" }, { list: [phone], zone: "Europe/Helsinki", withWho: false }));
    expect(outside).toContain("Tam Ossory: -100, Launched or flew outside the group's times");
    expect(outside).not.toContain("Kit Rowe");
  });

  it("marks a phone's penalty set aside by an officer as set aside, with who for members", () => {
    const members = new TextDecoder("latin1").decode(resultsPdf(s, { name: "Reed Cup", day: "2027-05-08", field: "Meadow" }, { list: [setAside], zone: "Europe/Helsinki", withWho: true }));
    expect(members).toContain("set aside by Ola Brand");
    expect(members).toContain("not counted \\(set aside\\)");
  });
});
