import { describe, expect, it } from "vitest";
import { getPageId, stampFromInput } from "@/lib/offline/device";
import { stampSchema } from "@/lib/events/schema";

describe("stampFromInput", () => {
  it("keeps the input's own monotonic time and takes wall time as now minus the lag since it", () => {
    // input at mono 5000; the handler runs at mono 5120, wall 1 700 000 000 000
    const clocks = { monoNow: () => 5120, wallNow: () => 1_700_000_000_000 };
    const offset = { thetaMs: 12, deltaMs: 30, measuredAtWallMs: 1_699_999_000_000 };
    const s = stampFromInput(5000, offset, clocks, "page-x");
    expect(s).toEqual({ wallMs: 1_699_999_999_880, monoMs: 5000, pageId: "page-x", offset });
    expect(stampSchema.safeParse(s).success).toBe(true);
  });

  it("uses one page id per page lifetime", () => {
    expect(getPageId()).toBe(getPageId());
    expect(stampFromInput(0, null, { monoNow: () => 0, wallNow: () => 1 }).pageId).toBe(getPageId());
  });
});
