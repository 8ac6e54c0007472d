import { describe, expect, it } from "vitest";
import { setMeta } from "@/lib/offline/db";
import { readPhoneView } from "@/lib/offline/run-result";
import { freshDbsPerTest } from "./helpers";

const open = freshDbsPerTest();

describe("readPhoneView (the phone's id, user and clock estimate in one read)", () => {
  it("gives nulls on a phone that has none of them", async () => {
    expect(await readPhoneView(open())).toEqual({ deviceId: null, me: null, estimate: null });
  });

  it("gives the stored values, the user's id from the profile", async () => {
    const db = open();
    const estimate = { thetaMs: 120, deltaMs: 30, measuredAtWallMs: 1_767_000_000_000 };
    await setMeta(db, "deviceId", "phone-7");
    await setMeta(db, "profile", { id: "u-9", name: "Ada", email: "ada@example.com" });
    await setMeta(db, "clockEstimate", estimate);
    expect(await readPhoneView(db)).toEqual({ deviceId: "phone-7", me: "u-9", estimate });
  });
});
