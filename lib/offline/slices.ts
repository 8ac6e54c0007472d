import type { z } from "zod";

/** Let the browser handle input and paint before the next slice of work (setTimeout elsewhere). */
export function yieldToMain(): Promise<void> {
  const scheduler = (globalThis as { scheduler?: { yield?: () => Promise<void> } }).scheduler;
  if (typeof scheduler?.yield === "function") return scheduler.yield();
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/** Items checked per slice at most: a slice of a pull page stays well under a long task on a slow phone. */
export const SLICE = 50;

/**
 * And at most this long (ms) per slice: on a slow or busy phone 50 items took longer than a long
 * task's 50 ms (measured: ~1 ms an item at 4× CPU under load, /field's first pull), so a slice also
 * ends once it has run this long, whatever the phone.
 */
export const SLICE_BUDGET_MS = 10;

/**
 * Check each item with `schema`, a slice at a time, yielding between slices: a page of 500 pulled
 * records no longer holds the main thread for one long task (issue #10, /field's first load): a
 * slice ends after `size` items or SLICE_BUDGET_MS, whichever comes first (`now` is the clock).
 * The first item that fails ends it, with its position and the schema's message.
 */
export async function parseInSlices<S extends z.ZodType>(
  items: readonly unknown[],
  schema: S,
  size: number = SLICE,
  now: () => number = () => performance.now(),
): Promise<{ ok: true; value: z.infer<S>[] } | { ok: false; message: string }> {
  const out: z.infer<S>[] = [];
  let inSlice = 0;
  let sliceStart = now();
  for (let i = 0; i < items.length; i++) {
    if (inSlice >= size || (inSlice > 0 && now() - sliceStart >= SLICE_BUDGET_MS)) {
      await yieldToMain();
      inSlice = 0;
      sliceStart = now();
    }
    const parsed = schema.safeParse(items[i]);
    if (!parsed.success) return { ok: false, message: `item ${i + 1}: ${parsed.error.issues[0]?.message ?? "invalid"}` };
    out.push(parsed.data);
    inSlice++;
  }
  return { ok: true, value: out };
}

/**
 * Build lazy schemas (lib/events/lazy-schema.ts) one per task, yielding between them: listed inner ones
 * first, each build is a short task, where the first parse building them all at once was one long task.
 */
export async function buildInSlices(schemas: readonly object[]): Promise<void> {
  for (const schema of schemas) {
    Reflect.has(schema, "_zod"); // any look at a lazy schema builds it
    await yieldToMain();
  }
}
