import { z } from "zod";
import { taskLetterSchema } from "@/lib/tasks/definition";
import { text } from "./bounds";
import { calendarDaySchema } from "./calendar-day";

export const createContestSchema = z.object({
  name: text(80).trim().min(2, "Give the contest a name of at least 2 characters.").max(80, "Use at most 80 characters."),
  startsOn: calendarDaySchema,
  fieldName: text(80).trim().min(1, "Choose the field.").max(80, "Use at most 80 characters."),
  rounds: z.array(z.object({ letter: taskLetterSchema })).min(1, "Add at least one round.").max(20, "At most 20 rounds."),
  maxGroupSize: z.number().int().min(5, "Groups hold at least 5 pilots (F3K.9.1).").max(30, "At most 30 pilots a group."),
  prepMinutes: z.number().int().min(1).max(60),
  noFlySeconds: z.number().int().min(0).max(600),
  dropRule: z.enum(["f3k", "none"]),
  practice: z.boolean(),
});
export type CreateContestInput = z.infer<typeof createContestSchema>;

export const contestIdSchema = z.object({ contestId: z.uuid("Not a contest.") });
export const entryIdSchema = z.object({ contestId: z.uuid("Not a contest."), entryId: z.uuid("Not an entry.") });

/** A signed-in pilot's entry: up to five models from their hangar (F3K.2.3). */
export const enterSchema = z.object({
  modelIds: z.array(z.uuid("Not a model.")).max(5, "At most five models (F3K.2.3).").refine((a) => new Set(a).size === a.length, "A model is listed twice."),
});

const keepApart = text(40).trim().max(40, "Use at most 40 characters.").nullable().optional().transform((s) => (s ? s : null));

/** The officer's paper entry: a pilot without an account (or entering on paper). */
export const paperEntrySchema = z.object({
  pilotName: text(80).trim().min(2, "Give the pilot's name.").max(80, "Use at most 80 characters."),
  models: z.array(text(80).trim().min(1).max(80)).max(5, "At most five models (F3K.2.3).").default([]),
  keepApart,
});

export const drawSchema = z.object({ seed: z.number().int().min(0).max(2_147_483_647).optional() });

const roundNumber = z.number({ error: "Choose a round." }).int("Choose a round.").min(1, "Choose a round.").max(20, "Contests have at most 20 rounds.");

/** Two pilots (entry ids) of one round trade groups. */
export const swapSchema = z.object({
  round: roundNumber,
  a: z.uuid("Choose the first pilot."),
  b: z.uuid("Choose the second pilot."),
});

/** The rounds from `fromRound` on are drawn again; the seed is chosen when not given. */
export const redrawSchema = z.object({ fromRound: roundNumber, seed: drawSchema.shape.seed });
