import { describe, expect, it } from "vitest";
import { flightInstants } from "@/lib/results/flight-instants";
import type { RecordedEvent } from "@/lib/results/place";
import { runResult } from "@/lib/results";
import { getCatalogueTask } from "@/lib/tasks";

const T0 = 1_767_000_100_000;

describe("flight instants on the corrected clock (lib/results/flight-instants.ts)", () => {
  it("a derived lane gives its launches in epoch ms, not from the working-time signal", () => {
    const ev = (i: number, atMs: number, body: RecordedEvent["body"]): RecordedEvent => ({
      id: `00000000-0000-7000-8000-00000000000${i}`, deviceId: "phone", seq: i, recordedBy: "u", body, stamp: { wallMs: atMs, monoMs: atMs - T0 + 1000, pageId: "p", offset: null },
    });
    const events = [ev(1, T0, { kind: "window-start" }), ev(2, T0 + 20_000, { kind: "launch", lane: 0 }), ev(3, T0 + 30_000, { kind: "landing", lane: 0 })];
    const [lane] = runResult({ task: getCatalogueTask("H"), createdBy: "u", lanes: [{ lane: 0, pilotUserId: "u" }], officials: new Set(), events, estimatesByDevice: new Map() }).lanes;
    const derived = JSON.parse(JSON.stringify(lane!.derived));
    expect(derived.flights[0].launchMs).toBe(20_000);
    expect(flightInstants(derived)).toEqual([{ index: 0, launchAtMs: T0 + 20_000, landAtMs: T0 + 30_000, timeTenths: 100 }]);
  });

  it("a lane derived before flights carried their instants takes them from the chosen version", () => {
    const old = {
      flights: [{ index: 0, launchMs: 20_000, landMs: 30_000, timeTenths: 100 }, { index: 1, launchMs: 40_000, landMs: null, timeTenths: 0 }],
      versions: [{ chosen: false, flights: [] }, { chosen: true, flights: [{ launchAtMs: T0 + 20_000, landAtMs: T0 + 30_000 }, { launchAtMs: T0 + 40_000, landAtMs: null }] }],
    };
    expect(flightInstants(old)).toEqual([
      { index: 0, launchAtMs: T0 + 20_000, landAtMs: T0 + 30_000, timeTenths: 100 },
      { index: 1, launchAtMs: T0 + 40_000, landAtMs: null, timeTenths: 0 },
    ]);
    expect(flightInstants({ flights: [{ index: 0, launchMs: 20_000, landMs: 30_000 }] })).toEqual([]); // nothing to place it by: left out
    expect(flightInstants(null)).toEqual([]);
  });
});
