import type { z } from "zod";

/** Let the browser handle input and paint before the next slice of work (setTimeout elsewhere). */
export function yieldToMain(): Promise<void> {
  const scheduler = (globalThis as { scheduler?: { yield?: () => Promise<void> } }).scheduler;
  if (typeof scheduler?.yield === "function") return scheduler.yield();
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/** Items checked per slice: a slice of a pull page stays well under a long task on a slow phone. */
export const SLICE = 50;

/**
 * Check each item with `schema`, a slice at a time, yielding between slices: a page of 500 pulled
 * records no longer holds the main thread for one long task (issue #10, /field's first load).
 * The first item that fails ends it, with its position and the schema's message.
 */
export async function parseInSlices<S extends z.ZodType>(
  items: readonly unknown[],
  schema: S,
  size: number = SLICE,
): Promise<{ ok: true; value: z.infer<S>[] } | { ok: false; message: string }> {
  const out: z.infer<S>[] = [];
  for (let start = 0; start < items.length; start += size) {
    if (start > 0) await yieldToMain();
    for (let i = start; i < Math.min(items.length, start + size); i++) {
      const parsed = schema.safeParse(items[i]);
      if (!parsed.success) return { ok: false, message: `item ${i + 1}: ${parsed.error.issues[0]?.message ?? "invalid"}` };
      out.push(parsed.data);
    }
  }
  return { ok: true, value: out };
}
