import Dexie from "dexie";
import { v7 as uuidv7 } from "uuid";
import { describe, expect, it } from "vitest";
import {
  catalogueChoiceOf,
  nextItemIndex,
  planDraftErrors,
  practicePlanSchema,
  progressAfter,
  readPlanProgress,
  type PracticePlan,
} from "@/lib/field/practice-plan";
import { createWindowcallDb } from "@/lib/offline/db";
import { buildCustomTask, getCatalogueTask } from "@/lib/tasks";

const K = getCatalogueTask("K");
const H = getCatalogueTask("H", 600);
const plan = (items = [K, H]): PracticePlan => ({ id: uuidv7(), title: "Ladder week", items, createdAtWallMs: 1_700_000_000_000 });

describe("practicePlanSchema", () => {
  it("accepts a plan of catalogue tasks and trims the title", () => {
    const out = practicePlanSchema.parse({ ...plan(), title: "  Ladder week  " });
    expect(out.title).toBe("Ladder week");
    expect(out.items.map((d) => d.letter)).toEqual(["K", "H"]);
  });

  it("bounds the title to 1–80 characters", () => {
    expect(planDraftErrors({ title: "   ", items: [K] })).toEqual({ title: "Give the plan a title." });
    expect(planDraftErrors({ title: "x".repeat(81), items: [K] })?.title).toMatch(/80 characters/);
    expect(planDraftErrors({ title: "x".repeat(80), items: [K] })).toBeNull();
  });

  it("bounds the items to 1–12", () => {
    expect(planDraftErrors({ title: "T", items: [] })).toEqual({ items: "Add at least one task to the plan." });
    expect(planDraftErrors({ title: "T", items: Array(13).fill(K) })?.items).toMatch(/at most 12/);
    expect(planDraftErrors({ title: "T", items: Array(12).fill(K) })).toBeNull();
  });

  it("names both problems at once and refuses a broken task definition", () => {
    expect(planDraftErrors({ title: "", items: [] })).toEqual({ title: "Give the plan a title.", items: "Add at least one task to the plan." });
    expect(practicePlanSchema.safeParse({ ...plan(), items: [{ ...K, workingTimeSec: 5 }] }).success).toBe(false);
    expect(practicePlanSchema.safeParse({ ...plan(), id: "not-a-uuid" }).success).toBe(false);
  });
});

describe("nextItemIndex and progress", () => {
  it("walks the plan in order and starts over after the last item", () => {
    const p = plan([K, H, K]);
    expect([0, 1, 2, 3, 4, 7].map((n) => nextItemIndex(p, n))).toEqual([0, 1, 2, 0, 1, 1]);
  });

  it("stores the item after the one set up, wrapping at the end", () => {
    const p = plan();
    expect(progressAfter(p, 0)).toEqual({ planId: p.id, itemIndex: 1 });
    expect(progressAfter(p, 1)).toEqual({ planId: p.id, itemIndex: 0 });
  });

  it("reads stored progress, falling back to the first item on anything unusable", () => {
    const p = plan();
    expect(readPlanProgress(p, JSON.stringify(progressAfter(p, 0)))).toBe(1);
    expect(readPlanProgress(p, null)).toBe(0);
    expect(readPlanProgress(p, "{not json")).toBe(0);
    expect(readPlanProgress(p, JSON.stringify({ planId: "other", itemIndex: 1 }))).toBe(0);
    expect(readPlanProgress(p, JSON.stringify({ planId: p.id, itemIndex: -1 }))).toBe(0);
    // The plan lost items since: the stored index wraps instead of pointing past the end.
    expect(readPlanProgress(p, JSON.stringify({ planId: p.id, itemIndex: 5 }))).toBe(1);
  });

  it("maps catalogue items back to letter and variant, and custom tasks to null", () => {
    expect(catalogueChoiceOf(H)).toEqual({ letter: "H", variant: 600 });
    expect(catalogueChoiceOf(getCatalogueTask("C", 3))).toEqual({ letter: "C", variant: 3 });
    const custom = buildCustomTask({ name: "Long ones", workingTimeSec: 600, counting: "best", count: 2, capSec: 180 });
    expect(catalogueChoiceOf(custom)).toBeNull();
  });
});

describe("the device database, version 2", () => {
  it("adds the plans table and keeps a version 1 database's data", async () => {
    const name = `test-${uuidv7()}`;
    const v1 = new Dexie(name);
    v1.version(1).stores({ events: "id, runId, [deviceId+seq]", outbox: "id, queueSeq, kind", sessions: "id, ownerId, startedAtWallMs", runs: "id, sessionId", meta: "key", clockSamples: "++id, burstId" });
    await v1.table("meta").put({ key: "deviceId", value: "dev-1" });
    v1.close();

    const db = createWindowcallDb(name);
    const p = plan();
    await db.plans.add(p);
    expect(await db.plans.get(p.id)).toEqual(p);
    expect(await db.meta.get("deviceId")).toEqual({ key: "deviceId", value: "dev-1" });
    expect(db.verno).toBe(2);
    db.close();
  });
});
