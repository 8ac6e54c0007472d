const format = new Intl.DateTimeFormat("en-GB", {
  day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", timeZone: "UTC", timeZoneName: "short",
});

/** An instant as admins read it: one time zone (UTC) for every viewer, e.g. "3 Dec 2026, 22:10 UTC". */
export function When({ date }: { date: Date | null }) {
  if (!date) return <span>–</span>;
  return <time dateTime={date.toISOString()}>{format.format(date)}</time>;
}
