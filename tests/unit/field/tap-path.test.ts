import fc from "fast-check";
import { beforeEach, describe, expect, it, vi } from "vitest";
import type { EventBody } from "@/lib/events/schema";
import { tapKindFor } from "@/lib/field/lane-tap";
import { CATALOGUE, liveState, type TimelineEvent } from "@/lib/tasks";

// Counts the live computation (results, best possible, hints, warnings) without changing it.
const live = vi.hoisted(() => ({ calls: 0 }));
vi.mock("@/lib/tasks/live", async (original) => {
  const actual = await original<typeof import("@/lib/tasks/live")>();
  return {
    ...actual,
    liveState: (...args: Parameters<typeof actual.liveState>) => {
      live.calls += 1;
      return actual.liveState(...args);
    },
  };
});

const id = (n: number) => `00000000-0000-7000-8000-${String(n).padStart(12, "0")}`;

describe("a tap's path before its write (issue #10, speed at the field; our choice)", () => {
  beforeEach(() => {
    live.calls = 0;
  });

  it("decides launch or landing without computing the live state: results and hints come after the write", () => {
    const events: TimelineEvent[] = [{ id: id(0), atMs: 0, body: { kind: "window-start" } }];
    for (let i = 1; i <= 30; i++) events.push({ id: id(i), atMs: i * 20_000, body: { kind: i % 2 ? "launch" : "landing", lane: 0 } });
    expect(tapKindFor(events, 0, 1)).toBe("launch");
    events.push({ id: id(31), atMs: 640_000, body: { kind: "launch", lane: 0 } });
    expect(tapKindFor(events, 0, 1)).toBe("landing");
    expect(live.calls).toBe(0);
  });

  it("agrees with the live state's flight in the air for any taps, undos and lanes, in every catalogue task", () => {
    const lanes = 4;
    const step = fc.oneof(
      fc.record({ kind: fc.constantFrom("launch", "landing") as fc.Arbitrary<"launch" | "landing">, lane: fc.integer({ min: 0, max: lanes - 1 }) }),
      fc.record({ kind: fc.constant("void" as const), back: fc.nat(6) }),
      fc.record({ kind: fc.constantFrom("window-start", "run-end") as fc.Arbitrary<"window-start" | "run-end"> }),
    );
    const tasks = Object.values(CATALOGUE).flat();
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: tasks.length - 1 }),
        fc.array(fc.record({ step, gapMs: fc.integer({ min: 0, max: 200_000 }) }), { maxLength: 40 }),
        fc.integer({ min: 0, max: lanes - 1 }),
        (taskIndex, steps, lane) => {
          const task = tasks[taskIndex]!;
          const events: TimelineEvent[] = [];
          let at = 0;
          steps.forEach(({ step: s, gapMs }, i) => {
            at += gapMs;
            let body: EventBody;
            if (s.kind === "void") {
              const target = events[events.length - 1 - s.back];
              if (!target) return;
              body = { kind: "void", targetId: target.id };
            } else body = "lane" in s ? { kind: s.kind, lane: s.lane } : { kind: s.kind };
            events.push({ id: id(i + 1), atMs: at, body });
          });
          const inAir = liveState(task, events, at + 1, { laneCount: lanes }).lanes[lane]?.currentFlightMs != null;
          expect(tapKindFor(events, lane, lanes)).toBe(inAir ? "landing" : "launch");
        },
      ),
      { numRuns: 300 },
    );
  });
});
