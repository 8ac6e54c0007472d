import { describe, expect, it } from "vitest";
import type { RunEvent } from "@/lib/events/schema";
import { LaneTenthsMemo } from "@/lib/offline/lane-tenths";
import { runResult } from "@/lib/results";
import { getCatalogueTask } from "@/lib/tasks";

const ME = "pilot";
const DEVICE = "device-a";
const task = getCatalogueTask("A");
const view = { deviceId: DEVICE, me: ME, estimate: null };

function runOf(n: number) {
  const runId = `00000000-0000-7000-8000-${String(n).padStart(12, "0")}`;
  const ev = (k: number, monoMs: number, body: RunEvent["body"]): RunEvent => ({
    id: `00000000-0000-7000-8${String(n).padStart(3, "0")}-${String(k).padStart(12, "0")}`, runId, deviceId: DEVICE, seq: k,
    stamp: { wallMs: 1_800_000_000_000 + monoMs, monoMs, pageId: "page-1", offset: null }, body,
  });
  const events = [
    ev(1, 10_000, { kind: "window-start" }),
    ev(2, 11_000, { kind: "launch", lane: 0 }),
    ev(3, 11_000 + 60_000 + n * 1000, { kind: "landing", lane: 0 }),
    ev(4, 200_000, { kind: "run-end" }),
  ];
  const run = { id: runId, task, lanes: [{ lane: 0, pilotName: "Ada", pilotUserId: ME }] };
  return { run, events };
}

const serverTenths = (events: readonly RunEvent[]) =>
  runResult({
    task, createdBy: ME, lanes: [{ lane: 0, pilotUserId: ME }], officials: new Set(), estimatesByDevice: new Map(),
    events: events.map((e) => ({ ...e, recordedBy: ME })),
  }).lanes.map((l) => l.resultTenths);

describe("LaneTenthsMemo (the field list's lane results)", () => {
  it("gives the server's result, scores a run again only when its events change, and holds only the listed runs", () => {
    const memo = new LaneTenthsMemo();
    const a = runOf(1);
    const first = memo.tenths(a.run, task, a.events, view);
    expect(first).toEqual(serverTenths(a.events));
    expect(first[0]).toBe(610); // 61 s flown (60 s + 1 s), in tenths
    expect(memo.tenths(a.run, task, [...a.events], view)).toBe(first); // same events: the remembered result

    const pulled = a.events.map((e) => ({ ...e, recordedBy: ME })); // a pulled copy names its recorder
    const again = memo.tenths(a.run, task, pulled, view);
    expect(again).not.toBe(first);
    expect(again).toEqual(serverTenths(a.events));

    const b = runOf(2);
    expect(memo.tenths(b.run, task, b.events, view)).toEqual(serverTenths(b.events));
    expect(memo.size).toBe(2);
    memo.retain([b.run.id]); // run a left the list (deleted, or older than the newest ones)
    expect(memo.size).toBe(1);
    expect(memo.tenths(b.run, task, b.events, view)[0]).toBe(620);
  });
});
