import { describe, expect, it } from "vitest";
import { currentModel } from "@/components/field/model-picker";
import type { RunEvent } from "@/lib/events/schema";
import { eventBodySchema } from "@/lib/events/schema";

const M1 = "0192f1a0-0000-7000-8000-000000000001";
const M2 = "0192f1a0-0000-7000-8000-000000000002";
let seq = 0;
const ev = (body: RunEvent["body"], id = `0192f1a0-0000-7000-8000-${String(++seq).padStart(12, "0")}`): RunEvent => ({
  id, runId: "r", deviceId: "d", seq, stamp: { wallMs: seq, monoMs: seq, pageId: "p", offset: null }, body,
});

describe("the lane's model on the field (a 'model' event per choice or swap)", () => {
  it("is part of the sync contract: a lane and a model id", () => {
    expect(eventBodySchema.safeParse({ kind: "model", lane: 0, modelId: M1 }).success).toBe(true);
    expect(eventBodySchema.safeParse({ kind: "model", lane: 4, modelId: M1 }).success).toBe(false);
    expect(eventBodySchema.safeParse({ kind: "model", lane: 0, modelId: "not-a-uuid" }).success).toBe(false);
  });

  it("is the latest choice of that lane, and an undone swap gives the earlier model back", () => {
    const pick = ev({ kind: "model", lane: 0, modelId: M1 });
    const swap = ev({ kind: "model", lane: 0, modelId: M2 });
    const other = ev({ kind: "model", lane: 1, modelId: M1 });
    expect(currentModel([pick, swap, other], 0)).toBe(M2);
    expect(currentModel([pick, swap, other, ev({ kind: "void", targetId: swap.id })], 0)).toBe(M1);
    expect(currentModel([other], 0)).toBeNull();
  });
});
