import { z } from "zod";
import { MAX_FLY_OFF_PILOTS, MIN_FLY_OFF_PILOTS } from "@/lib/contests/fly-off-draw";
import { CURRENCIES, MAX_FEE_CENTS, MIN_FEE_CENTS } from "@/lib/payments/fees";
import { FLY_OFF_ROUNDS } from "@/lib/scoring/fly-off";
import { CATALOGUE_EDITION } from "@/lib/tasks/catalogue";
import { taskLetterSchema } from "@/lib/tasks/definition";
import { text } from "./bounds";
import { calendarDaySchema } from "./calendar-day";

export const HALVES = ["half-up", "half-even", "down"] as const;
export const PILOT_CLASSES = ["senior", "junior"] as const;
const pilotClass = z.enum(PILOT_CLASSES, "Choose senior or junior.");

export const createContestSchema = z.object({
  name: text(80).trim().min(2, "Give the contest a name of at least 2 characters.").max(80, "Use at most 80 characters."),
  startsOn: calendarDaySchema,
  fieldName: text(80).trim().min(1, "Choose the field.").max(80, "Use at most 80 characters."),
  rounds: z.array(z.object({ letter: taskLetterSchema })).min(1, "Add at least one round.").max(20, "At most 20 rounds."),
  /** The fly-off's rounds, each with its task (3–6, F3K.10; task M only here), and how many pilots qualify; none: no fly-off. */
  flyOffRounds: z.array(z.object({ letter: taskLetterSchema }), "Give the fly-off rounds as a list.").max(FLY_OFF_ROUNDS.max, `A fly-off has at most ${FLY_OFF_ROUNDS.max} rounds (F3K.10).`).default([]),
  flyOffPilots: z.number("Give how many pilots fly the fly-off.").int("Give a whole number of pilots for the fly-off.")
    .min(MIN_FLY_OFF_PILOTS, `At least ${MIN_FLY_OFF_PILOTS} pilots fly a fly-off.`).max(MAX_FLY_OFF_PILOTS, `At most ${MAX_FLY_OFF_PILOTS} pilots fly a fly-off (one group).`).nullable().default(null),
  maxGroupSize: z.number().int().min(5, "Groups hold at least 5 pilots (F3K.9.1).").max(30, "At most 30 pilots a group."),
  prepMinutes: z.number().int().min(1).max(60),
  noFlySeconds: z.number().int().min(0).max(600),
  dropRule: z.enum(["f3k", "none"]),
  practice: z.boolean(),
  /** How an exact half of 0.1 point rounds in normalised scores (the README's setting) and the rules' edition. */
  halves: z.enum(HALVES, "Choose how halves round.").default("half-up"),
  rulesEdition: z.enum([CATALOGUE_EDITION], "Choose an edition of the rules this app implements.").default(CATALOGUE_EDITION),
  /** The entry fee in cents (null or absent: free) and the instant entries close (refunds only before it). */
  entryFeeCents: z.number().int("Give the fee in whole cents.").min(MIN_FEE_CENTS, "An entry fee is at least 0.50.").max(MAX_FEE_CENTS, "An entry fee is at most 1000.00.").nullable().default(null),
  currency: z.enum(CURRENCIES, "Choose a currency from the list.").default("eur"),
  entriesCloseAt: z.iso.datetime({ offset: true, message: "Give the closing time as a date and time." }).nullable().default(null)
    .refine((s) => s === null || (Date.parse(s) > Date.parse("2000-01-01T00:00:00Z") && Date.parse(s) < Date.parse("2200-01-01T00:00:00Z")), "Entries close between 2000 and 2200."),
}).superRefine((c, ctx) => {
  if (c.flyOffRounds.length > 0 && c.flyOffPilots === null) ctx.addIssue({ code: "custom", path: ["flyOffPilots"], message: "Give how many pilots fly the fly-off." });
  if (c.flyOffRounds.length === 0 && c.flyOffPilots !== null) ctx.addIssue({ code: "custom", path: ["flyOffRounds"], message: "Plan the fly-off's rounds (3 to 6, F3K.10), or leave the number of fly-off pilots empty." });
  if (c.entryFeeCents !== null && c.entriesCloseAt === null) ctx.addIssue({ code: "custom", path: ["entriesCloseAt"], message: "A contest with an entry fee needs the time entries close (withdrawals before it are refunded)." });
  if (c.entriesCloseAt !== null && Date.parse(c.entriesCloseAt) > Date.parse(`${c.startsOn}T23:59:59Z`) + 14 * 3600_000) ctx.addIssue({ code: "custom", path: ["entriesCloseAt"], message: "Entries close on the contest day at the latest." });
});
export type CreateContestInput = z.infer<typeof createContestSchema>;

export const contestIdSchema = z.object({ contestId: z.uuid("Not a contest.") });
export const entryIdSchema = z.object({ contestId: z.uuid("Not a contest."), entryId: z.uuid("Not an entry.") });

/** A signed-in pilot's entry: up to five models from their hangar (F3K.2.3). */
export const enterSchema = z.object({
  modelIds: z.array(z.uuid("Not a model.")).max(5, "At most five models (F3K.2.3).").refine((a) => new Set(a).size === a.length, "A model is listed twice."),
  pilotClass: pilotClass.default("senior"),
});

/** The officer's changes to an entry: its team (F3K.10.4; empty: none) and its class. At least one. */
export const entryChangeSchema = z.object({
  team: text(40).trim().max(40, "Use at most 40 characters for a team.").nullable().optional().transform((s) => (s === undefined ? undefined : s ? s : null)),
  pilotClass: pilotClass.optional(),
}).refine((c) => c.team !== undefined || c.pilotClass !== undefined, "Give a team or a class.");

const keepApart = text(40).trim().max(40, "Use at most 40 characters.").nullable().optional().transform((s) => (s ? s : null));

/** The officer's paper entry: a pilot without an account (or entering on paper). */
export const paperEntrySchema = z.object({
  pilotName: text(80).trim().min(2, "Give the pilot's name.").max(80, "Use at most 80 characters."),
  models: z.array(text(80).trim().min(1).max(80)).max(5, "At most five models (F3K.2.3).").default([]),
  keepApart,
  pilotClass: pilotClass.default("senior"),
});

export const drawSchema = z.object({
  seed: z.number().int().min(0).max(2_147_483_647).optional(),
  /** Confirms that results already entered in the preliminary rounds are deleted with the old draw. */
  replaceResults: z.boolean("Say whether results may be replaced.").default(false),
});

const roundNumber = z.number({ error: "Choose a round." }).int("Choose a round.").min(1, "Choose a round.").max(20, "Contests have at most 20 rounds.");

/** Two pilots (entry ids) of one round trade groups. */
export const swapSchema = z.object({
  round: roundNumber,
  a: z.uuid("Choose the first pilot."),
  b: z.uuid("Choose the second pilot."),
});

/** The rounds from `fromRound` on are drawn again; the seed is chosen when not given. */
export const redrawSchema = z.object({ fromRound: roundNumber, seed: z.number().int().min(0).max(2_147_483_647).optional() });

/** Draws the fly-off from the preliminary order; `replaceResults` confirms that fly-off results already entered are deleted. */
export const flyOffDrawSchema = z.object({ replaceResults: z.boolean("Say whether fly-off results may be replaced.").default(false) });
