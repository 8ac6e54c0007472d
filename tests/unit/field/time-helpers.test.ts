import { describe, expect, it } from "vitest";
import { formatCountdown, formatRunning, secondsText } from "@/lib/field/display";
import { inputMonoOf, MAX_INPUT_LAG_MS, stampForMoment } from "@/lib/field/input-time";
import { parseFlightTime } from "@/lib/field/flight-fix";
import { isNativePerformanceNow, manualTimeSource } from "@/lib/field/time-source";

describe("inputMonoOf", () => {
  it("keeps the input's own timestamp when it lies on the page's monotonic clock", () => {
    expect(inputMonoOf(1234.5, 1240)).toEqual({ monoMs: 1234.5, fromInput: true });
  });
  it("falls back to now for an epoch-based or future timestamp", () => {
    expect(inputMonoOf(1_700_000_000_000, 5000)).toEqual({ monoMs: 5000, fromInput: false });
    expect(inputMonoOf(6000, 5000)).toEqual({ monoMs: 5000, fromInput: false });
    expect(inputMonoOf(5000 - MAX_INPUT_LAG_MS - 1, 5000).fromInput).toBe(false);
  });
});

describe("stampForMoment", () => {
  it("derives the monotonic time of a planned moment from the wall clock", () => {
    const clocks = manualTimeSource(1_000_000, 50_000);
    expect(stampForMoment(990_000, clocks, "p", null)).toEqual({ wallMs: 990_000, monoMs: 40_000, pageId: "p", offset: null });
  });
});

describe("formatCountdown", () => {
  it("reads whole seconds rounded up, and 0:00 only when the time is over", () => {
    expect(formatCountdown(600_000)).toBe("10:00");
    expect(formatCountdown(599_001)).toBe("10:00");
    expect(formatCountdown(599_000)).toBe("9:59");
    expect(formatCountdown(510_000)).toBe("8:30");
    expect(formatCountdown(1)).toBe("0:01");
    expect(formatCountdown(0)).toBe("0:00");
    expect(formatCountdown(-5)).toBe("0:00");
  });
});

describe("formatRunning", () => {
  it("truncates to the tenth, never rounds up (F3K.7: 183.96 s → 183.9 s)", () => {
    expect(formatRunning(183_960)).toBe("3:03.9");
    expect(formatRunning(63_099)).toBe("1:03.0");
    expect(formatRunning(0)).toBe("0:00.0");
  });
  it("shows tenths as seconds", () => {
    expect(secondsText(5690)).toBe("569.0");
  });
});

describe("parseFlightTime", () => {
  it("reads seconds, tenths and m:ss", () => {
    expect(parseFlightTime("63")).toBe(630);
    expect(parseFlightTime("63.4")).toBe(634);
    expect(parseFlightTime("1:03,4")).toBe(634);
    expect(parseFlightTime("1:75")).toBeNull();
    expect(parseFlightTime("abc")).toBeNull();
    expect(parseFlightTime("63.45")).toBeNull();
  });
});

describe("isNativePerformanceNow", () => {
  it("tells a built-in clock function from a replacement written in script", () => {
    const original = performance.now;
    try {
      // Node's performance.now is itself script, so a built-in stands in for the browser's.
      performance.now = Date.now;
      expect(isNativePerformanceNow()).toBe(true);
      performance.now = () => 42;
      expect(isNativePerformanceNow()).toBe(false);
    } finally {
      performance.now = original;
    }
  });
});
