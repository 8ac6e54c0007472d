import { z } from "zod";

/** The days the app accepts: its own era, and well inside what PostgreSQL's date and timestamptz hold (year 0000 is not one). */
export const FIRST_DAY = "2000-01-01";
export const LAST_DAY = "2999-12-31";

/** Whether "YYYY-MM-DD" names a real day (Date.parse takes 2026-02-30 for 2 March). */
export function isCalendarDay(s: string): boolean {
  const t = Date.parse(`${s}T00:00:00Z`);
  return !Number.isNaN(t) && new Date(t).toISOString().slice(0, 10) === s;
}

/** A calendar day YYYY-MM-DD that exists (no 2026-02-30), from FIRST_DAY to LAST_DAY. */
export const calendarDaySchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "A day is written YYYY-MM-DD.")
  .refine(isCalendarDay, "That day does not exist.")
  .refine((s) => s >= FIRST_DAY && s <= LAST_DAY, "Choose a day between the years 2000 and 2999.");
