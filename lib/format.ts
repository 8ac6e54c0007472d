const dateFormat = new Intl.DateTimeFormat("en-GB", { weekday: "short", day: "numeric", month: "short", year: "numeric" });

/** A session date, e.g. "Sat 14 Mar 2026". */
export function formatDate(date: Date): string {
  return dateFormat.format(date);
}
