/**
 * A schema built on first use instead of when its module is evaluated (issue #10: building the sync
 * contract's zod schemas was one long task of /field's load, before the page had anything to check).
 * `lazySchema(() => z.object(…))` has the built schema's exact type and behaves as it: every property
 * read (`safeParse`, `shape`, `extend`, zod's internal `_zod`), `in`, `instanceof` and a schema nesting
 * it go to the one instance `build` makes the first time any of them is needed. Methods come bound to
 * that instance. `build` must not read the schema it defines.
 */
export function lazySchema<T extends object>(build: () => T): T {
  let built: T | undefined;
  const real = (): T => (built ??= build());
  const bound = new Map<PropertyKey, { of: unknown; fn: unknown }>();
  return new Proxy({} as T, {
    get(_, prop) {
      const target = real();
      const value: unknown = Reflect.get(target, prop, target);
      if (typeof value !== "function") return value;
      // one bound copy per method, so reading it twice gives the same function
      const kept = bound.get(prop);
      if (kept?.of === value) return kept.fn;
      const fn = (value as (...args: unknown[]) => unknown).bind(target);
      bound.set(prop, { of: value, fn });
      return fn;
    },
    set(_, prop, value) {
      const target = real();
      return Reflect.set(target, prop, value, target);
    },
    has: (_, prop) => Reflect.has(real(), prop),
    ownKeys: () => Reflect.ownKeys(real()),
    getOwnPropertyDescriptor(_, prop) {
      const d = Reflect.getOwnPropertyDescriptor(real(), prop);
      // the proxy's own target is an empty object: a property it lacks may only be reported as configurable
      return d && { ...d, configurable: true };
    },
    getPrototypeOf: () => Reflect.getPrototypeOf(real()),
  });
}
