import Link from "next/link";

/** The admin page's own search parameters, kept when one list turns a page. */
export type AdminParams = Record<string, string>;

/**
 * Newer/older links under one of the admin lists (its page in `param` of /admin's URL, so a page
 * can be shared and the other lists keep theirs); back to the list's own heading.
 */
export function ListPager({ params, param, page, more, section, label }: { params: AdminParams; param: string; page: number; more: boolean; section: string; label: string }) {
  if (page === 1 && !more) return null;
  const href = (to: number) => {
    const next = new URLSearchParams(params);
    if (to === 1) next.delete(param);
    else next.set(param, String(to));
    const query = next.toString();
    return `/admin${query ? `?${query}` : ""}#${section}-h`;
  };
  return (
    <nav aria-label={`Pages of the ${label}`} className="flex justify-between pt-2">
      {page > 1 ? <Link href={href(page - 1)} className="inline-flex min-h-touch items-center font-bold underline">‹ Newer</Link> : <span />}
      <span className="self-center text-sm text-muted">page {page}</span>
      {more ? <Link href={href(page + 1)} className="inline-flex min-h-touch items-center font-bold underline">Older ›</Link> : <span />}
    </nav>
  );
}
