import { z } from "zod";
import { calendarDaySchema } from "./calendar-day";

export const openClubDaySchema = z.object({
  fieldId: z.uuid({ message: "Choose one of the club's fields." }),
  day: calendarDaySchema,
});
export type OpenClubDay = z.infer<typeof openClubDaySchema>;

/** The date in a Day board address (/clubs/[slug]/days/[date]); anything else names no day (404). */
export function dayParam(value: unknown): string | null {
  const day = calendarDaySchema.safeParse(value);
  return day.success ? day.data : null;
}

/** A member turns the day-summary e-mails of one club on or off. */
export const daySummariesSchema = z.object({
  on: z.boolean({ message: "Say on (true) or off (false)." }),
});

/** A pilot puts a run in one of their clubs' field days (chosen: true) or takes it out (false). */
export const chooseDaySchema = z.object({
  dayId: z.uuid({ message: "Choose one of your clubs' field days." }),
  chosen: z.boolean({ message: "Say whether the run belongs to the day (true or false)." }),
});
