import { z } from "zod";

/** A calendar day, YYYY-MM-DD, that exists (no 2026-02-30) and fits the database's date column. */
export const clubDayDateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "A day is written YYYY-MM-DD.")
  .refine((value) => {
    const parsed = new Date(`${value}T00:00:00Z`);
    const year = Number(value.slice(0, 4));
    return year >= 2000 && year <= 2999 && !Number.isNaN(parsed.getTime()) && parsed.toISOString().slice(0, 10) === value;
  }, "That day does not exist.");

export const openClubDaySchema = z.object({
  fieldId: z.uuid({ message: "Choose one of the club's fields." }),
  day: clubDayDateSchema,
});
export type OpenClubDay = z.infer<typeof openClubDaySchema>;
