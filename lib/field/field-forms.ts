import { z } from "zod";
import { PENALTY_CAUSES, REFLIGHT_CAUSES, REFLIGHT_PLACEMENTS } from "@/lib/events/schema";
import { parseFlightTime } from "./flight-fix";

/**
 * The field screen's small forms as typed (numbers still text), each message in plain words
 * beside its field (react-hook-form's zod resolver). The handlers turn the values into events;
 * bad input never reaches them, so it writes nothing.
 */

const wholeText = (min: number, max: number, message: string) =>
  z.string().refine((s) => /^\s*\d+\s*$/.test(s) && Number(s) >= min && Number(s) <= max, message);

/** A penalty: what happened, its points, in which flight, mid-air or not, details (needed for "something else"). */
export const penaltyFormSchema = z
  .object({
    cause: z.enum(PENALTY_CAUSES),
    points: wholeText(1, 1000, "Points are a whole number from 1 to 1000."),
    launchId: z.string(),
    midAir: z.boolean(),
    reason: z.string().max(200, "Keep the details under 200 characters."),
  })
  .refine((f) => f.cause !== "other" || f.reason.trim() !== "", { path: ["reason"], message: "Say what happened." });
export type PenaltyForm = z.infer<typeof penaltyFormSchema>;

/** A re-flight: its grounds and where it is flown (choices only). */
export const reflightFormSchema = z.object({ cause: z.enum(REFLIGHT_CAUSES), placement: z.enum(REFLIGHT_PLACEMENTS) });
export type ReflightForm = z.infer<typeof reflightFormSchema>;

/** A typed flight or launch time ("63.4" or "1:03.4"). */
export const flightTimeFormSchema = z.object({
  time: z.string().refine((s) => parseFlightTime(s) !== null, "Type the time as seconds (63.4) or minutes:seconds (1:03.4)."),
});
export type FlightTimeForm = z.infer<typeof flightTimeFormSchema>;

/** Task E: a target typed instead of picked. */
export const targetFormSchema = z.object({ target: wholeText(1, 3600, "A target is a whole number of seconds, 1 to 3600.") });
export type TargetForm = z.infer<typeof targetFormSchema>;
