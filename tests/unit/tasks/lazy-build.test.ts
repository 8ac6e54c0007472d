import { describe, expect, it, vi } from "vitest";

// Counts every schema zod builds through `z.*` (z.object, z.enum, z.number…), from the moment lib/tasks is imported.
const built = vi.hoisted(() => ({ count: 0 }));
vi.mock("zod", async (importOriginal) => {
  const real = await importOriginal<typeof import("zod")>();
  const z = new Proxy(real.z, {
    get(target, prop, receiver) {
      const value: unknown = Reflect.get(target, prop, receiver);
      if (typeof value !== "function") return value;
      return (...args: unknown[]) => {
        built.count++;
        return (value as (...a: unknown[]) => unknown)(...args);
      };
    },
  });
  return { ...real, z };
});

describe("lib/tasks builds its schemas on first use (issue #10)", () => {
  it("evaluating the task engine builds no zod schema; the first parse builds them and parses as before", async () => {
    // /field's islands import lib/tasks while the page loads: building the task definition schemas there was one long task
    const tasks = await import("@/lib/tasks");
    expect(built.count).toBe(0);
    const h = tasks.getCatalogueTask("H");
    expect(tasks.taskDefinitionSchema.safeParse(h).success).toBe(true);
    expect(built.count).toBeGreaterThan(0);
    // still the same checks: an in-order ladder counting all flights needs a launch limit of its length (our rule, definition.ts)
    const bad = { ...tasks.getCatalogueTask("K"), launchLimit: 1 };
    const parsed = tasks.taskDefinitionSchema.safeParse(bad);
    expect(parsed.success).toBe(false);
    expect(tasks.taskLetterSchema.safeParse("Z").success).toBe(false);
    expect(() => tasks.buildCustomTask({ name: "", workingTimeSec: 600 })).toThrow("Give the task a name.");
  });
});
