import { describe, expect, it } from "vitest";
import { describeSync } from "@/components/sync/describe-sync";
import type { SyncStatus } from "@/lib/offline/sync-client";

const status = (patch: Partial<SyncStatus>): SyncStatus =>
  ({ unsent: 0, rejected: [], lastSyncAt: null, lastError: null, state: "idle", nextRetryAt: null, offset: null, ...patch }) as SyncStatus;

describe("the sync badge's words (issue #10: offline it said Syncing)", () => {
  it("says Offline and counts what waits when the browser has no network, even mid-attempt", () => {
    expect(describeSync(status({ state: "syncing", unsent: 4 }), false).label).toBe("Offline — 4 waiting");
    expect(describeSync(status({ state: "idle", unsent: 2 }), false).label).toBe("Offline — 2 waiting");
    expect(describeSync(null, false).label).toBe("Offline");
  });
  it("says Offline — N waiting when a push found no network", () => {
    expect(describeSync(status({ state: "offline", unsent: 7 }), true).label).toBe("Offline — 7 waiting");
    expect(describeSync(status({ state: "offline", unsent: 0 }), true).label).toBe("Offline");
  });
  it("online, keeps its other words", () => {
    expect(describeSync(status({ state: "syncing", unsent: 3 }), true).label).toBe("Syncing");
    expect(describeSync(status({ unsent: 3 }), true).label).toBe("3 unsent");
    expect(describeSync(status({}), true).label).toBe("Synced");
    expect(describeSync(status({ state: "signed-out", unsent: 1 }), false).label).toBe("Signed out");
  });
});
