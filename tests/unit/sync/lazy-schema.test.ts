import { describe, expect, it } from "vitest";
import { z } from "zod";
import { zodResolver } from "@hookform/resolvers/zod";
import { lazySchema } from "@/lib/events/lazy-schema";

// lib/events/lazy-schema.ts: the sync contract's schemas are built on first use (issue #10). A lazy schema
// must answer exactly as the schema it stands for, wherever the contract uses one (parse, nesting, extend,
// shape, discriminated unions, instanceof), and build it once, only when first needed.

const eager = () =>
  z.object({ id: z.uuid(), kind: z.literal("a"), n: z.number().int().min(1).max(10), note: z.string().max(5).optional() });

describe("lazySchema", () => {
  it("does not build until first used, then builds once", () => {
    let builds = 0;
    const s = lazySchema(() => {
      builds++;
      return eager();
    });
    expect(builds).toBe(0);
    expect(s.safeParse({ id: "0190a7e2-9a3c-7d1e-8f00-000000000001", kind: "a", n: 3 }).success).toBe(true);
    expect(s.safeParse({ kind: "a", n: 3 }).success).toBe(false);
    expect(Object.keys(s.shape)).toEqual(["id", "kind", "n", "note"]);
    expect(builds).toBe(1);
  });

  it("gives the same results and messages as the eager schema, also nested, extended and in a discriminated union", () => {
    const lazy = lazySchema(eager);
    const inputs: unknown[] = [
      { id: "0190a7e2-9a3c-7d1e-8f00-000000000001", kind: "a", n: 3, note: "ok", extra: 1 },
      { id: "not-a-uuid", kind: "a", n: 3 },
      { id: "0190a7e2-9a3c-7d1e-8f00-000000000001", kind: "a", n: 11 },
      { id: "0190a7e2-9a3c-7d1e-8f00-000000000001", kind: "b", n: 1 },
      { id: "0190a7e2-9a3c-7d1e-8f00-000000000001", kind: "a", n: 2, note: "too long" },
      null,
    ];
    const wrap = (inner: z.ZodType) => z.object({ items: z.array(inner), at: z.number() });
    const union = (inner: typeof lazy) => z.discriminatedUnion("kind", [inner, z.object({ kind: z.literal("c") })]);
    for (const input of inputs) {
      const [a, b] = [eager().safeParse(input), lazy.safeParse(input)];
      expect(b).toEqual(a);
      expect(wrap(lazy).safeParse({ items: [input], at: 1 })).toEqual(wrap(eager()).safeParse({ items: [input], at: 1 }));
      expect(lazy.extend({ n: z.string() }).safeParse(input)).toEqual(eager().extend({ n: z.string() }).safeParse(input));
      expect(union(lazy).safeParse(input)).toEqual(union(eager()).safeParse(input));
      expect(lazy.optional().safeParse(input)).toEqual(eager().optional().safeParse(input));
    }
    expect(lazy instanceof z.ZodObject).toBe(true);
    expect(lazy.shape.n instanceof z.ZodNumber).toBe(true);
    expect("safeParse" in lazy).toBe(true);
    expect(lazy.safeParse).toBe(lazy.safeParse);
  });

  it("parse throws the same ZodError as the eager schema", () => {
    const lazy = lazySchema(eager);
    expect(() => lazy.parse({})).toThrow(z.ZodError);
    let a: unknown, b: unknown;
    try { eager().parse({}); } catch (e) { a = (e as z.ZodError).issues; }
    try { lazy.parse({}); } catch (e) { b = (e as z.ZodError).issues; }
    expect(b).toEqual(a);
  });

  it("works with the forms' zod resolver as the eager schema does (react-hook-form; the hangar and plan forms)", async () => {
    const options = { fields: {}, shouldUseNativeValidation: false } as never; // the resolver reads only these two
    const faults: string[][] = [];
    for (const values of [{ id: "0190a7e2-9a3c-7d1e-8f00-000000000001", kind: "a" as const, n: 3 }, { id: "x", kind: "a" as const, n: 30 }]) {
      const [a, b] = await Promise.all([zodResolver(eager())(values, undefined, options), zodResolver(lazySchema(eager))(values, undefined, options)]);
      expect(b).toEqual(a);
      faults.push(Object.keys(b.errors));
    }
    expect(faults).toEqual([[], ["id", "n"]]);
  });
});
