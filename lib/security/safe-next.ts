/**
 * Where to go after signing in: only a path on this site. `?next=` comes from the address bar, so
 * anything that could leave the site (`//elsewhere`, `/\elsewhere`, `https://…`, `javascript:…`)
 * falls back to the home page.
 */
export function safeNextPath(next: string | null | undefined, fallback = "/"): string {
  if (!next || next.length > 2000) return fallback;
  // A single leading slash, not followed by another slash or a backslash (browsers read `/\` as `//`).
  if (!next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return fallback;
  // Control characters (tabs and newlines are dropped by URL parsers, turning `/\t/x` into `//x`).
  if (/[\u0000-\u001f\u007f\\]/.test(next)) return fallback;
  try {
    const base = "http://windowcall.invalid";
    const url = new URL(next, base);
    if (url.origin !== base) return fallback;
    return url.pathname + url.search + url.hash;
  } catch {
    return fallback;
  }
}
