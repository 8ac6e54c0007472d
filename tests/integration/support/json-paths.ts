/** A copy of `v` with the value at path `at` (object keys and array indexes) replaced by `value` (the root when `at` is empty). */
export function replaced(v: unknown, at: (string | number)[], value: unknown): unknown {
  if (at.length === 0) return value;
  const [head, ...rest] = at;
  const copy = (Array.isArray(v) ? [...v] : { ...(v as object) }) as Record<string | number, unknown>;
  copy[head!] = replaced(copy[head!], rest, value);
  return copy;
}
