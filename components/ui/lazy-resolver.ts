import type { FieldValues, Resolver } from "react-hook-form";

/**
 * A react-hook-form resolver that loads its real one (the zod resolver and the form's schema,
 * with zod itself) on the first validation, not with the page: the sign-in page paints and
 * becomes usable without zod in its first load. The messages are the real resolver's.
 */
export function lazyResolver<T extends FieldValues>(load: () => Promise<Resolver<T>>): Resolver<T> {
  let loading: Promise<Resolver<T>> | undefined;
  return async (values, context, options) => {
    loading ??= load().catch((e: unknown) => {
      loading = undefined; // offline on the first try: try again on the next submit
      throw e;
    });
    return (await loading)(values, context, options);
  };
}
