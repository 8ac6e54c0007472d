import { z } from "zod";
import { calendarDaySchema } from "./calendar-day";

export const openClubDaySchema = z.object({
  fieldId: z.uuid({ message: "Choose one of the club's fields." }),
  day: calendarDaySchema,
});
export type OpenClubDay = z.infer<typeof openClubDaySchema>;
