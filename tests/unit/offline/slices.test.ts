import { describe, expect, it } from "vitest";
import { z } from "zod";
import { parseInSlices, SLICE_BUDGET_MS } from "@/lib/offline/slices";

const schema = z.object({ n: z.number().int() });

describe("parseInSlices (a pulled page is checked a slice at a time)", () => {
  it("returns every item parsed, in order", async () => {
    const items = Array.from({ length: 123 }, (_, n) => ({ n, extra: "dropped" }));
    const r = await parseInSlices(items, schema, 50);
    expect(r).toEqual({ ok: true, value: items.map(({ n }) => ({ n })) });
  });

  it("gives other work a turn between slices (a timer queued before it runs between slices)", async () => {
    const order: string[] = [];
    const slow = z.unknown().transform((v) => {
      order.push(`item ${String(v)}`);
      return v;
    });
    setTimeout(() => order.push("timer"), 0);
    await parseInSlices([1, 2, 3, 4, 5], slow, 2);
    // Without the yield, all five items would come before the timer.
    expect(order.indexOf("timer")).toBeGreaterThan(0);
    expect(order.indexOf("timer")).toBeLessThan(order.length - 1);
    expect(order.filter((o) => o !== "timer")).toEqual(["item 1", "item 2", "item 3", "item 4", "item 5"]);
  });

  it("also ends a slice once it has run SLICE_BUDGET_MS, however few items it checked (a slow phone)", async () => {
    const order: string[] = [];
    const slow = z.unknown().transform((v) => {
      order.push(`item ${String(v)}`);
      return v;
    });
    // a clock that says each item took a whole budget: every item is a slice of its own
    let t = 0;
    const clock = () => (t += SLICE_BUDGET_MS);
    setTimeout(() => order.push("timer"), 0);
    await parseInSlices([1, 2, 3], slow, 50, clock);
    // with 50 items a slice and no budget, all three items would run before the timer
    expect(order.indexOf("timer")).toBeGreaterThan(0);
    expect(order.indexOf("timer")).toBeLessThan(order.indexOf("item 3"));
    expect(order.filter((o) => o !== "timer")).toEqual(["item 1", "item 2", "item 3"]);
  });

  it("stops at the first bad item and names its position", async () => {
    const r = await parseInSlices([{ n: 1 }, { n: 2 }, { n: "three" }, { n: 4 }], schema, 2);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/^item 3: /);
  });
});

describe("buildInSlices (the pull's lazy schemas built one per task)", () => {
  it("builds each lazy schema in turn, giving other work a turn between builds", async () => {
    const { lazySchema } = await import("@/lib/events/lazy-schema");
    const { buildInSlices } = await import("@/lib/offline/slices");
    const order: string[] = [];
    const lazy = (name: string) =>
      lazySchema(() => {
        order.push(`build ${name}`);
        return z.object({ name: z.literal(name) });
      });
    const [a, b] = [lazy("a"), lazy("b")];
    expect(order).toEqual([]);
    setTimeout(() => order.push("timer"), 0);
    await buildInSlices([a, b]);
    expect(order).toEqual(["build a", "timer", "build b"]);
    expect(a.safeParse({ name: "a" }).success).toBe(true);
    expect(order).toHaveLength(3); // built once
  });
});
