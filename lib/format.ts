const dateFormat = new Intl.DateTimeFormat("en-GB", { weekday: "short", day: "numeric", month: "short", year: "numeric" });

/** A session date, e.g. "Sat 14 Mar 2026". */
export function formatDate(date: Date): string {
  return dateFormat.format(date);
}

const clockStyles = {
  /** "Sat 14 Mar 2026, 18:00 CET" */
  long: { weekday: "short", day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" },
  /** "14 Mar, 18:00 CET" */
  short: { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" },
  /** "18:00 CET" */
  time: { hour: "2-digit", minute: "2-digit" },
} as const satisfies Record<string, Intl.DateTimeFormatOptions>;

/**
 * A moment on the clock of a place (a club's IANA time zone), with the zone's short name so nobody
 * mistakes it for their own: entries closing, a draw change, a signature. An unknown zone falls back to UTC.
 */
export function formatClock(date: Date, timeZone: string, style: keyof typeof clockStyles = "long"): string {
  const options = { ...clockStyles[style], timeZoneName: "short" } as const;
  try {
    return new Intl.DateTimeFormat("en-GB", { ...options, timeZone }).format(date);
  } catch {
    return new Intl.DateTimeFormat("en-GB", { ...options, timeZone: "UTC" }).format(date);
  }
}
