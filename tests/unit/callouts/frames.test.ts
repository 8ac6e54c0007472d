import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { getCatalogueTask } from "@/lib/tasks";
import { eventLog } from "../tasks/helpers";
import { due } from "./helpers";

describe("frame independence", () => {
  // One flight in the air from 5 s until after the landing window, so nothing the callouts
  // depend on changes between frames: any split into frames must say the same callouts once each.
  const G = getCatalogueTask("G");
  const log = eventLog();
  log.start(0);
  log.launch(5_000);
  const whole = due(G, log.events, -1, 640_000).map((c) => c.id);

  it("frames of any length say exactly what one sweep says, each id once", () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 0, max: 639_999 }), { maxLength: 60 }), (cuts) => {
        const bounds = [-1, ...[...cuts].sort((a, b) => a - b), 640_000];
        const ids: string[] = [];
        for (let i = 1; i < bounds.length; i++) ids.push(...due(G, log.events, bounds[i - 1]!, bounds[i]!).map((c) => c.id));
        expect(ids).toEqual(whole);
      }),
      { numRuns: 200 },
    );
  });

  it("the sweep holds the minute marks, the cap countdown, the last 10 s and the landing window", () => {
    expect(whole.filter((id) => id.startsWith("wt:min:"))).toHaveLength(10);
    expect(whole.filter((id) => id.startsWith("target:0:5000:120:"))).toHaveLength(7);
    expect(whole.filter((id) => id.startsWith("lw:"))).toHaveLength(12);
  });
});
