import { z } from "zod";
import { isTimeZone } from "@/lib/days/time-zone";
import { text } from "./bounds";
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

/** An officer's decision on a lane two phones recorded differently: whose version stands (null: a note only), and a note. */
export const dayDecisionSchema = z
  .object({
    runId: z.uuid({ message: "Name the run." }),
    lane: z.number({ message: "Name the lane by its number." }).int("Name the lane by its number.").min(0, "Name the lane by its number.").max(63, "Name the lane by its number."),
    deviceId: text(200).trim().min(1, "Name the phone whose record stands, or none.").max(200, "Name the phone whose record stands, or none.").nullable(),
    note: text(500).trim().max(500, "Keep the note to 500 characters.").default(""),
  })
  .refine((d) => d.deviceId !== null || d.note.length > 0, { message: "Choose the record that stands, or write a note.", path: ["note"] });
export type DayDecisionInput = z.infer<typeof dayDecisionSchema>;

/** A club's time zone: an IANA name Intl knows (lib/days/time-zone.ts). */
export const clubTimeZoneSchema = z.object({
  timeZone: text(64).trim().max(64, "Choose a time zone from the list.").refine(isTimeZone, "Choose a time zone from the list (an IANA name such as Europe/Berlin)."),
});
