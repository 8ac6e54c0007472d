import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { RunEvent } from "@/lib/events/schema";
import { phoneResult } from "@/lib/offline/run-result";
import { runResult } from "@/lib/results";
import { getCatalogueTask, liveState, msToTenths } from "@/lib/tasks";

const TASKS = ["H", "G", "E", "A", "K"].map((l) => getCatalogueTask(l as "H"));
const ME = "pilot";
const DEVICE = "device-a";
let n = 0;
const id = () => `00000000-0000-7000-8000-${String(++n).padStart(12, "0")}`;

/**
 * A run timed on one phone: flights back to back, the wall clock wandering against the steady
 * clock by `jitter` ms per event (within and beyond the tolerance), a reload after event `reloadAt`.
 */
function timedRun(task: (typeof TASKS)[number], secs: number[], jitter: number[], reloadAt: number, targets: number[]): RunEvent[] {
  const events: RunEvent[] = [];
  let mono = 10_000;
  let wallDrift = 0;
  let page = "page-1";
  const add = (body: RunEvent["body"]) => {
    const k = events.length;
    wallDrift += jitter[k % jitter.length]!;
    if (k === reloadAt) page = "page-2";
    events.push({ id: id(), runId: "00000000-0000-7000-8000-999999999999", deviceId: DEVICE, seq: k + 1, stamp: { wallMs: 1_800_000_000_000 + mono + wallDrift, monoMs: mono, pageId: page, offset: null }, body });
  };
  add({ kind: "window-start" });
  secs.forEach((s, i) => {
    mono += 700;
    if (task.kind === "poker") add({ kind: "target", lane: 0, targetSec: targets[i % targets.length]! });
    add({ kind: "launch", lane: 0 });
    mono += s * 1000 + (i % 7) * 37;
    add({ kind: "landing", lane: 0 });
  });
  add({ kind: "run-end" });
  return events;
}

describe("one path from events to result (ours)", () => {
  it("the field (live and closed), the logbook and the server read the same result, never above the flights' sum", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: TASKS.length - 1 }),
        fc.array(fc.integer({ min: 1, max: 200 }), { minLength: 1, maxLength: 8 }),
        fc.array(fc.integer({ min: -1500, max: 1500 }), { minLength: 1, maxLength: 5 }),
        fc.integer({ min: 0, max: 30 }),
        fc.array(fc.integer({ min: 10, max: 120 }), { minLength: 1, maxLength: 3 }),
        (t, secs, jitter, reloadAt, targets) => {
          const task = TASKS[t]!;
          const events = timedRun(task, secs, jitter, reloadAt, targets);
          const run = { lanes: [{ lane: 0, pilotName: "Ada", pilotUserId: ME }] };
          const view = { deviceId: DEVICE, me: ME, estimate: null };
          const phone = phoneResult(run, task, events, view); // field list, closed field screen, logbook, run page
          const server = runResult({
            task, createdBy: ME, lanes: [{ lane: 0, pilotUserId: ME }], officials: new Set(), estimatesByDevice: new Map(),
            events: events.map((e) => ({ ...e, recordedBy: ME })),
          });
          const lane = phone.folded.lanes[0]!;
          const live = liveState(task, phone.timeline, Math.max(...phone.timeline.map((e) => e.atMs)) + 3_600_000, { laneCount: 1 }).lanes[0]!;
          expect(server.lanes[0]!.resultTenths).toBe(lane.resultTenths);
          expect(phone.lanes[0]!.resultTenths).toBe(lane.resultTenths);
          expect(live.resultTenths).toBe(lane.resultTenths);
          // what the flight list, the flight table and the strip show for each flight
          const shown = lane.flights.reduce((sum, f) => sum + (f.airTenths ?? 0), 0);
          expect(lane.flights.map((f) => f.airTenths)).toEqual(lane.flights.map((f) => (f.landMs === null ? null : msToTenths(f.landAtMs! - f.launchAtMs))));
          expect(lane.resultTenths).toBeLessThanOrEqual(shown);
          expect(server.lanes[0]!.derived.flights.map((f) => f.creditedTenths)).toEqual(lane.flights.map((f) => f.creditedTenths));
        },
      ),
      { seed: 10, numRuns: 300 },
    );
  });
});

describe("the device clock offset, applied on the phone as on the server (SYNC.md §4)", () => {
  it("a launch 10 s after a signal given on another phone counts on both, though this phone's clock is 30 s slow", () => {
    const N = getCatalogueTask("N");
    const A = "phone-a"; // times the lane; its clock runs 30 s behind the server
    const B = "phone-b"; // gives the working-time signal; its clock is right
    const offA = { thetaMs: 30_000, deltaMs: 20, measuredAtWallMs: 1_799_999_000_000 };
    const offB = { thetaMs: 0, deltaMs: 20, measuredAtWallMs: 1_800_000_000_000 };
    const T = 1_800_000_100_000; // server time of the signal
    const ev = (deviceId: string, recordedBy: string, serverMs: number, offset: typeof offA, body: RunEvent["body"]): RunEvent & { recordedBy: string } => ({
      id: id(), runId: "00000000-0000-7000-8000-999999999999", deviceId, seq: 1, recordedBy,
      stamp: { wallMs: serverMs - offset.thetaMs, monoMs: serverMs - 1_800_000_000_000, pageId: `page-${deviceId}`, offset }, body,
    });
    const events = [
      ev(B, "keeper", T, offB, { kind: "window-start" }),
      ev(A, ME, T + 10_000, offA, { kind: "launch", lane: 0 }),
      ev(A, ME, T + 100_000, offA, { kind: "landing", lane: 0 }),
    ];
    const run = { lanes: [{ lane: 0, pilotName: "Ada", pilotUserId: ME }], recordedBy: { id: "keeper", name: "Keeper" } };
    // Phone A knows only its own clock estimate; the server knows both phones'.
    const phone = phoneResult(run, N, events, { deviceId: A, me: ME, estimate: offA });
    const server = runResult({
      task: N, createdBy: "keeper", lanes: [{ lane: 0, pilotUserId: ME }], officials: new Set(), events, estimatesByDevice: new Map([[A, [offA]], [B, [offB]]]),
    });
    expect(server.lanes[0]!.resultTenths).toBe(900);
    expect(phone.lanes[0]!.resultTenths).toBe(900);
    expect(phone.folded.lanes[0]!.resultTenths).toBe(900);
  });
});
