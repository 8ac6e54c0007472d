import { describe, expect, it } from "vitest";
import { LogFileError, parseAltimeterCsv } from "@/lib/altimeter/parse";
import type { LogUploadMapping } from "@/lib/altimeter/mapping";

const T = Date.UTC(2026, 5, 14, 10, 0, 0);
const metres: LogUploadMapping = {
  loggerName: "test",
  startAtMs: T,
  mapping: { hasHeader: true, timeColumn: 1, timeKind: "seconds", utcOffsetMin: 0, valueColumn: 2, valueKind: "m" },
};
const rows = (n: number, f: (i: number) => string) => Array.from({ length: n }, (_, i) => f(i)).join("\n");

function refusal(run: () => unknown): LogFileError {
  try {
    run();
  } catch (e) {
    if (e instanceof LogFileError) return e;
    throw e;
  }
  throw new Error("the file was accepted");
}

describe("altimeter CSV with a column mapping (lib/altimeter/parse.ts)", () => {
  it("reads seconds from the given start and heights in metres", () => {
    const s = parseAltimeterCsv(`t,alt\n${rows(12, (i) => `${i * 0.5},${i}`)}\n`, metres, T);
    expect(s[3]).toEqual({ tMs: T + 1500, hM: 3 });
    expect(s).toHaveLength(12);
  });

  it("reads clock times (with the logger's UTC offset) and feet", () => {
    const m: LogUploadMapping = { loggerName: "x", mapping: { ...metres.mapping, hasHeader: false, timeKind: "clock", utcOffsetMin: 120, valueKind: "ft" } };
    const s = parseAltimeterCsv(rows(12, (i) => `12:00:${String(i).padStart(2, "0")};100`), m, T);
    expect(s[2]!.tMs).toBe(T + 2000); // 12:00:02 at UTC+2 is 10:00:02 UTC
    expect(s[0]!.hM).toBeCloseTo(30.48, 6);
  });

  it("converts pressure with the standard atmosphere", () => {
    const m: LogUploadMapping = { ...metres, mapping: { ...metres.mapping, valueKind: "hPa" } };
    const s = parseAltimeterCsv(`t,p\n${rows(12, (i) => `${i},${i < 6 ? 1013.25 : 1000}`)}`, m, T);
    expect(s[0]!.hM).toBeCloseTo(0, 6);
    expect(s[11]!.hM).toBeCloseTo(110.9, 1);
  });

  it("names the line and the column of a bad value", () => {
    const e = refusal(() => parseAltimeterCsv(`t,alt\n0,1\n1,2\n2,abc\n${rows(10, (i) => `${i + 3},1`)}`, metres, T));
    expect(e.message).toBe('Line 4, column 2 (height): "abc" is not a number.');
    expect([e.line, e.column]).toEqual([4, 2]);
  });

  it("refuses a missing cell, a time running backwards, a file too short", () => {
    expect(refusal(() => parseAltimeterCsv(`t,alt\n0,1\n1\n`, metres, T)).message).toBe("Line 3, column 2 (height) is empty.");
    expect(refusal(() => parseAltimeterCsv(`t,alt\n${rows(12, (i) => `${i === 5 ? 1 : i},1`)}`, metres, T)).line).toBe(7);
    expect(refusal(() => parseAltimeterCsv("t,alt\n0,1\n", metres, T)).message).toMatch(/at least 10/);
  });
});
