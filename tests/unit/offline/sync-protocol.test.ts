import { v7 as uuidv7 } from "uuid";
import { describe, expect, it } from "vitest";
import type { RunEvent } from "@/lib/events/schema";
import { pullReplySchema, pushReplySchema, pushRequestSchema, timeReplySchema } from "@/lib/validations/sync";

const event = (seq: number): RunEvent => ({
  id: uuidv7(),
  runId: uuidv7(),
  deviceId: "dev-1",
  seq,
  stamp: { wallMs: 1, monoMs: 1, pageId: "p", offset: { thetaMs: -3, deltaMs: 8, measuredAtWallMs: 0 } },
  body: { kind: "landing", lane: 2 },
});

describe("sync protocol schemas", () => {
  it("accepts a push of up to 500 items and refuses 501", () => {
    const ok = { deviceId: "dev-1", sessions: [], runs: [], events: Array.from({ length: 500 }, (_, i) => event(i + 1)) };
    expect(pushRequestSchema.safeParse(ok).success).toBe(true);
    const tooMany = { ...ok, events: [...ok.events, event(501)] };
    expect(pushRequestSchema.safeParse(tooMany).error?.issues[0]?.message).toMatch(/500/);
  });

  it("requires all three arrays in a push", () => {
    expect(pushRequestSchema.safeParse({ deviceId: "d", events: [] }).success).toBe(false);
  });

  it("parses acks and refuses an unknown status", () => {
    expect(pushReplySchema.parse({ acks: [{ id: "a", status: "duplicate" }], serverSeq: 3 }).acks[0]?.status).toBe("duplicate");
    expect(pushReplySchema.safeParse({ acks: [{ id: "a", status: "ok" }], serverSeq: 3 }).success).toBe(false);
  });

  it("checks pulled items by their type", () => {
    const ev = event(1);
    expect(pullReplySchema.safeParse({ items: [{ type: "event", seq: 1, data: ev }], nextCursor: "812.1", hasMore: false }).success).toBe(true);
    expect(pullReplySchema.safeParse({ items: [{ type: "run", seq: 1, data: ev }], nextCursor: "812.1", hasMore: false }).success).toBe(false);
  });

  it("time reply echoes t1 with the server's receive and send times", () => {
    expect(timeReplySchema.safeParse({ t1: 1, t2: 2 }).success).toBe(false);
    expect(timeReplySchema.parse({ t1: 1, t2: 2, t3: 3 })).toEqual({ t1: 1, t2: 2, t3: 3 });
  });
});
