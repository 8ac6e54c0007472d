import { describe, expect, it } from "vitest";
import { consentFor, listedInLogbook } from "@/lib/offline/consent";
import type { StoredRun } from "@/lib/offline/db";

const base: StoredRun = {
  id: "run", sessionId: "session", task: {}, createdAtWallMs: 0,
  lanes: [{ lane: 0, pilotName: "Ada", pilotUserId: "ada" }, { lane: 1, pilotName: "Lena", pilotUserId: "lena" }],
};

describe("a run on the phone recorded for its pilot by someone else", () => {
  it("gives the pilot's lane and standing, none for the recorder or a run of one's own", () => {
    const run = { ...base, recordedBy: { id: "tobi", name: "Tobi" }, consents: [{ lane: 0, status: "disputed" as const, reason: "too short" }, { lane: 1, status: "pending" as const, reason: null }] };
    expect(consentFor(run, "ada")).toEqual({ lane: 0, status: "disputed", reason: "too short" });
    expect(consentFor(run, "lena")?.status).toBe("pending");
    expect(consentFor(run, "tobi")).toBeNull();
    expect(consentFor({ ...run, consents: [{ lane: 0, status: "own", reason: null }] }, "ada")).toBeNull();
  });

  it("counts a run pulled with a recorder but no consents as pending, and one recorded here as the pilot's own", () => {
    expect(consentFor({ ...base, recordedBy: { id: "tobi", name: "Tobi" } }, "ada")?.status).toBe("pending");
    expect(consentFor(base, "ada")).toBeNull();
  });

  it("leaves a hidden run out of the pilot's logbook, not out of the recorder's", () => {
    const run = { ...base, recordedBy: { id: "tobi", name: "Tobi" }, consents: [{ lane: 0, status: "hidden" as const, reason: null }] };
    expect(listedInLogbook(run, "ada")).toBe(false);
    expect(listedInLogbook(run, "tobi")).toBe(true);
    expect(listedInLogbook(run, "lena")).toBe(true);
  });
});
