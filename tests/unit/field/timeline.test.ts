import { describe, expect, it } from "vitest";
import { buildTimeline, placeEvent } from "@/lib/field/timeline";
import { stored } from "./helpers";

const ctx = { deviceId: "device-a", pageId: "page-1", wallNow: 1_000_000, monoNow: 500_000, thetaMs: null };

describe("buildTimeline", () => {
  it("anchors this page's events to now by the monotonic clock", () => {
    // The wall clock was stepped 400 ms forward after the launch: the monotonic age wins.
    const e = stored({ kind: "launch", lane: 0 }, { wallMs: 939_600, monoMs: 440_000 });
    expect(placeEvent(e, ctx)).toBe(940_000);
  });
  it("uses the stamped wall time after a reload (another page lifetime)", () => {
    const e = stored({ kind: "launch", lane: 0 }, { wallMs: 939_600, monoMs: 440_000, pageId: "page-0" });
    expect(placeEvent(e, ctx)).toBe(939_600);
  });
  it("uses the wall time when the device slept (monotonic and wall ages disagree)", () => {
    const e = stored({ kind: "launch", lane: 0 }, { wallMs: 900_000, monoMs: 490_000 });
    expect(placeEvent(e, ctx)).toBe(900_000);
  });
  it("moves another device's event by its offset, then back by ours (RFC 5905 offset = server − device)", () => {
    const offset = { thetaMs: 2000, deltaMs: 10, measuredAtWallMs: 899_000 };
    const e = stored({ kind: "landing", lane: 1 }, { wallMs: 900_000, offset }, "device-b");
    expect(placeEvent(e, { ...ctx, thetaMs: 500 })).toBe(901_500);
  });
  it("keeps a correction relative to the event it corrects", () => {
    const landing = stored({ kind: "landing", lane: 0 }, { wallMs: 939_600, monoMs: 440_000 });
    const fix = stored({ kind: "correct", targetId: landing.id, wallMs: 939_700 }, { wallMs: 990_000, monoMs: 490_000 });
    const [, placedFix] = buildTimeline([landing, fix], ctx);
    expect(placedFix?.body).toEqual({ kind: "correct", targetId: landing.id, wallMs: 940_100 });
  });
});
