import { describe, expect, it } from "vitest";
import { distanceM, FIELD_RADIUS_M, fieldOfSession, matchDayRuns } from "@/lib/days/matching";

// Invented places (no real field): a meadow at 47.2000 N, 8.4000 E and points around it.
const R = 6_371_008.8; // mean Earth radius (IUGG), the sphere distanceM uses
const meadow = { latitude: 47.2, longitude: 8.4 };
const north = (m: number) => ({ latitude: meadow.latitude + (m / R) * (180 / Math.PI), longitude: meadow.longitude });

describe("distanceM (haversine on a sphere)", () => {
  it("along a meridian is the arc R·Δφ (spherical geometry: arc length = radius × angle)", () => {
    expect(distanceM(meadow, north(600))).toBeCloseTo(600, 6);
    expect(distanceM({ latitude: 0, longitude: 0 }, { latitude: 1, longitude: 0 })).toBeCloseTo((R * Math.PI) / 180, 6);
  });
  it("along a parallel at 60° is about R·cos 60°·Δλ for a short hop; symmetric, zero at the same point", () => {
    const a = { latitude: 60, longitude: 10 };
    const b = { latitude: 60, longitude: 10.01 };
    expect(distanceM(a, b)).toBeCloseTo(R * 0.5 * (0.01 * Math.PI) / 180, 0);
    expect(distanceM(a, b)).toBe(distanceM(b, a));
    expect(distanceM(a, a)).toBe(0);
  });
});

describe("fieldOfSession: by place where both have one, else by name (our rule)", () => {
  const fields = [
    { name: "Five Acre Meadow", position: meadow },
    { name: "Old Quarry", position: north(5000) },
    { name: "Ridge Top", position: null },
  ];
  it("a session within the radius is at the field whatever name the phone gave it", () => {
    expect(FIELD_RADIUS_M).toBe(1000);
    expect(fieldOfSession({ fieldName: "the meadow by the barn", position: north(600) }, fields)?.name).toBe("Five Acre Meadow");
    expect(fieldOfSession({ fieldName: "x", position: north(999) }, fields)?.name).toBe("Five Acre Meadow");
    expect(fieldOfSession({ fieldName: "x", position: north(1001) }, fields)).toBeNull();
  });
  it("the same name at another place is not the field: the place wins", () => {
    expect(fieldOfSession({ fieldName: "Five Acre Meadow", position: north(3000) }, fields)).toBeNull();
    expect(fieldOfSession({ fieldName: "Five Acre Meadow", position: north(4800) }, fields)?.name).toBe("Old Quarry");
  });
  it("without a position on either side, the name decides (case and spacing ignored)", () => {
    expect(fieldOfSession({ fieldName: " five acre  MEADOW", position: null }, fields)?.name).toBe("Five Acre Meadow");
    expect(fieldOfSession({ fieldName: "Ridge Top", position: north(20_000) }, fields)?.name).toBe("Ridge Top"); // the field has none
    expect(fieldOfSession({ fieldName: "Somewhere else" }, fields)).toBeNull();
  });
  it("two fields within reach: the nearer one", () => {
    const close = [{ name: "A", position: meadow }, { name: "B", position: north(800) }];
    expect(fieldOfSession({ fieldName: "A", position: north(500) }, close)?.name).toBe("B");
  });
});

describe("matchDayRuns with positions", () => {
  const at = (iso: string) => Date.parse(iso);
  const run = (runId: string, sessionField: string, position: { latitude: number; longitude: number } | null, startIso: string, chosen = false) => ({
    runId, sessionField, sessionPosition: position, chosen, createdAtMs: at(startIso) - 900_000, laneDerived: [{ signal: { atMs: [at(startIso)] }, flights: [] }],
  });
  it("joins a run at the place under another name, not one elsewhere under the field's name; the time on the club's clock; a chosen run whatever", () => {
    const got = matchDayRuns(
      [
        run("here", "Barn side", north(300), "2026-06-14T10:00:00Z"),
        run("elsewhere", "Five Acre Meadow", north(2500), "2026-06-14T11:00:00Z"),
        run("no-fix", "Five Acre Meadow", null, "2026-06-14T12:00:00Z"),
        run("here-next-day", "Barn side", north(300), "2026-06-14T22:30:00Z"), // 00:30 on the 15th in Zurich's zone (CEST, UTC+2)
        run("chosen", "Elsewhere", north(9000), "2026-06-14T13:00:00Z", true),
      ],
      "2026-06-14",
      [{ name: "Five Acre Meadow", position: meadow }],
      "Europe/Zurich",
    );
    expect(got.map((r) => [r.runId, r.field])).toEqual([["here", "Five Acre Meadow"], ["no-fix", "Five Acre Meadow"], ["chosen", null]]);
  });
});
