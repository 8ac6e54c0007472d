// A club's clock: its IANA time zone (Intl, no table of our own), the bounds of a calendar date on
// it and the local date of an instant. Field days are dates on the club's clock, so a run at 23:30
// in a club five hours west of Greenwich belongs to that evening, not to the next UTC date.
// Pure: no framework, no I/O.

/** Whether Intl knows `name` as a time zone (an IANA name such as "Europe/Berlin", or "UTC"). */
export function isTimeZone(name: string): boolean {
  if (name.length === 0 || name.length > 64) return false;
  try {
    new Intl.DateTimeFormat("en-GB", { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

const partsFormats = new Map<string, Intl.DateTimeFormat>();
function partsFormat(timeZone: string): Intl.DateTimeFormat {
  let f = partsFormats.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat("en-US", {
      timeZone, hourCycle: "h23", year: "numeric", month: "2-digit", day: "2-digit", hour: "2-digit", minute: "2-digit", second: "2-digit",
    });
    partsFormats.set(timeZone, f);
  }
  return f;
}

/** The wall-clock fields of `ms` in `timeZone`. */
function localFields(ms: number, timeZone: string): { y: number; mo: number; d: number; h: number; mi: number; s: number } {
  const get: Record<string, number> = {};
  for (const p of partsFormat(timeZone).formatToParts(ms)) if (p.type !== "literal") get[p.type] = Number(p.value);
  return { y: get.year!, mo: get.month!, d: get.day!, h: get.hour!, mi: get.minute!, s: get.second! };
}

/** Local time minus UTC at the instant `ms`, in ms (whole seconds: what the zone data holds). */
export function zoneOffsetMs(ms: number, timeZone: string): number {
  const f = localFields(ms, timeZone);
  const asUtc = Date.UTC(f.y, f.mo - 1, f.d, f.h, f.mi, f.s);
  return asUtc - Math.floor(ms / 1000) * 1000;
}

/** The calendar date "YYYY-MM-DD" of the instant `ms` on the club's clock. */
export function localDate(ms: number, timeZone: string): string {
  const f = localFields(ms, timeZone);
  return `${String(f.y).padStart(4, "0")}-${String(f.mo).padStart(2, "0")}-${String(f.d).padStart(2, "0")}`;
}

/** The UTC instant of the local midnight that starts `day` in `timeZone` (a skipped midnight: the first instant after it). */
function localMidnight(day: string, timeZone: string): number {
  const guess = Date.parse(`${day}T00:00:00Z`);
  let t = guess - zoneOffsetMs(guess, timeZone);
  t = guess - zoneOffsetMs(t, timeZone); // the offset at the local midnight itself, not at UTC midnight
  // a zone that skips midnight (a change at 00:00) has no such instant: the day starts where the date does
  while (localDate(t, timeZone) < day) t += 3600_000;
  return t;
}

/** The bounds of the calendar day `day` on the club's clock, as UTC instants [start, end): 23, 24 or 25 hours. */
export function dayBounds(day: string, timeZone = "UTC"): { startMs: number; endMs: number } {
  const next = new Date(Date.parse(`${day}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);
  return { startMs: localMidnight(day, timeZone), endMs: localMidnight(next, timeZone) };
}
