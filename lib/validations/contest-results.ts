import { z } from "zod";
import { parseRoundKey, roundKey } from "@/lib/contests/round-key";
import { PAPER_MAX_FLIGHT_TENTHS, PAPER_MAX_FLIGHTS } from "@/lib/contests/paper-card";
import { PENALTY_CAUSES, REFLIGHT_CAUSES, REFLIGHT_PLACEMENTS } from "@/lib/events/schema";
import { fixedPenaltyPoints } from "@/lib/contests/penalties";
import { DISPUTE_ACTIONS } from "@/lib/contests/disputes";
import { text } from "./bounds";

/** A round's URL: `[roundNumber]` is "3" (round 3) or "fly-off-2" (fly-off round 2), lib/contests/round-key.ts. */
export const roundParamsSchema = z.object({
  contestId: z.uuid("Not a contest."),
  roundNumber: z.string().max(12, "Not a round.").transform((key, ctx) => {
    const ref = parseRoundKey(key);
    if (!ref) { ctx.addIssue({ code: "custom", message: "Not a round." }); return z.NEVER; }
    return ref;
  }),
}).transform(({ contestId, roundNumber }) => ({ contestId, roundNumber: roundNumber.number, flyOff: roundNumber.flyOff, roundKey: roundKey(roundNumber) }));

/** One group's paper cards in a round: per pilot the flight times (tenths of a second; null keeps a timed run), penalty points and the signature. */
export const groupCardsSchema = z.object({
  groupNumber: z.number().int().min(1, "Not a group.").max(99, "Not a group."),
  cards: z.array(z.object({
    entryId: z.uuid("Not an entry."),
    flights: z.array(z.number().int("Flight times are in tenths of a second.").min(0, "A flight time cannot be negative.").max(PAPER_MAX_FLIGHT_TENTHS, "A flight time is at most one hour."))
      .max(PAPER_MAX_FLIGHTS, `At most ${PAPER_MAX_FLIGHTS} flights on one card.`).nullable(),
    penaltyPoints: z.number().int("Penalties are whole points.").min(0, "Penalties are given as positive points.").max(10_000, "At most 10,000 penalty points."),
    signed: z.boolean(),
  })).min(1, "Enter at least one card.").max(30, "At most 30 cards in a group."),
});
export type GroupCardsInput = z.infer<typeof groupCardsSchema>;

export const resultsQuerySchema = z.object({ format: z.enum(["json", "csv", "flights-csv", "penalties-csv", "pdf"]).default("json") });
/** The public link: the same without the penalties CSV (it names the officers and timekeepers who gave them). */
export const publicResultsQuerySchema = z.object({ format: z.enum(["json", "csv", "flights-csv", "pdf"]).default("json") });

/** A public results link's secret: 32 random bytes, base64url. */
export const publicTokenSchema = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{43}$/, "Not a results link.") });

/** Links a timed run's lane to a pilot's slot in the round, or unlinks it (runId null). */
export const linkRunSchema = z.object({
  entryId: z.uuid("Not an entry."),
  runId: z.uuid("Not a run.").nullable(),
  lane: z.number().int("Not a lane.").min(0, "Not a lane.").max(49, "Not a lane.").nullable(),
}).refine((b) => (b.runId === null) === (b.lane === null), { message: "Give a run and its lane, or neither.", path: ["lane"] });

/** One group's timekeepers in a round: per pilot the timekeeper's account (null: none). */
export const groupTimekeepersSchema = z.object({
  groupNumber: z.number().int().min(1, "Not a group.").max(99, "Not a group."),
  timekeepers: z.array(z.object({
    entryId: z.uuid("Not an entry."),
    timekeeperUserId: z.uuid("Not a timekeeper.").nullable(),
  })).min(1, "Name at least one pilot.").max(30, "At most 30 pilots in a group."),
});
export type GroupTimekeepersInput = z.infer<typeof groupTimekeepersSchema>;

/** An officer grants a pilot drawn in the round a re-flight (F3K.9.6, F3K.4.2): why, where it is flown, whether they are the entitled re-flyer. */
export const grantReflightSchema = z.object({
  entryId: z.uuid("Not an entry."),
  cause: z.enum(REFLIGHT_CAUSES, "Choose why the re-flight is granted."),
  placement: z.enum(REFLIGHT_PLACEMENTS, "Choose where the re-flight is flown."),
  entitled: z.boolean().default(true),
  groupNumber: z.number().int().min(1, "Not a group.").max(99, "Not a group."),
  reason: text(200).trim().max(200, "At most 200 characters.").transform((s) => s || null).nullable().default(null),
});

/** A re-flight's result: a paper card's flight times (tenths), or a timed run's lane, or neither; and its signature. */
export const recordReflightSchema = z.object({
  entryId: z.uuid("Not an entry."),
  flights: z.array(z.number().int("Flight times are in tenths of a second.").min(0, "A flight time cannot be negative.").max(PAPER_MAX_FLIGHT_TENTHS, "A flight time is at most one hour."))
    .min(1, "Enter at least one flight, or none at all.").max(PAPER_MAX_FLIGHTS, `At most ${PAPER_MAX_FLIGHTS} flights on one card.`).nullable(),
  runId: z.uuid("Not a run.").nullable(),
  lane: z.number().int("Not a lane.").min(0, "Not a lane.").max(49, "Not a lane.").nullable(),
  signed: z.boolean(),
}).refine((b) => (b.runId === null) === (b.lane === null), { message: "Give a run and its lane, or neither.", path: ["lane"] })
  .refine((b) => b.flights === null || b.runId === null, { message: "A paper card or a timed run, not both.", path: ["flights"] });

/** The timekeeper whose phone times a pilot's granted re-flight in the round, or null for none. */
export const reflightTimekeeperSchema = z.object({
  entryId: z.uuid("Not an entry."),
  timekeeperUserId: z.uuid("Choose a timekeeper.").nullable(),
});

/**
 * The officer's decision on a re-flight request from a phone: dismiss it, or grant it (the request's cause;
 * where it is flown, the group and the note as on a grant, prefilled on the page from the request).
 */
export const decideReflightRequestSchema = z.discriminatedUnion("decision", [
  z.object({ requestId: z.uuid("Not a request."), decision: z.literal("dismiss") }),
  z.object({
    requestId: z.uuid("Not a request."), decision: z.literal("grant"),
    placement: grantReflightSchema.shape.placement, groupNumber: grantReflightSchema.shape.groupNumber,
    entitled: grantReflightSchema.shape.entitled, reason: grantReflightSchema.shape.reason,
  }),
], "Grant or dismiss the request.");

/** The officer's decision on a pilot's two records in a round: the waiting record to count, or null to keep the counting one. */
export const decideRecordsSchema = z.object({
  entryId: z.uuid("Not an entry."),
  recordId: z.uuid("Not a record.").nullable(),
});

/** An officer records a dispute about a pilot's result in the round: what is disputed and who lodged it (the pilot or a team manager). */
export const lodgeDisputeSchema = z.object({
  entryId: z.uuid("Not an entry."),
  subject: text(300).trim().min(1, "Say what is disputed."),
  lodgedBy: text(100).trim().min(1, "Say who lodged it."),
  /** When it was lodged (ISO 8601 with an offset); absent = now. The route refuses a time in the future or more than 2 days before the contest's day. */
  lodgedAt: z.iso.datetime({ offset: true, message: "Give the time it was lodged as a date and time." }).optional(),
});

/** The most penalty points one officer's penalty can carry (the rules' largest is 300, RULES.md "Penalties"). */
export const MAX_OFFICER_PENALTY = 1000;

/**
 * An officer gives a pilot drawn in the round a penalty: the cause (RULES.md "Penalties"), its points
 * (the rules' size for a cause that has one: F3K.4.3 100/300, F3K.9.5 100, F3K.2.4 100; the officer's
 * for a launch contact, F3K.4.1, or "other"), a note; `separate` says it is not the phone's penalty of
 * the same cause typed again (lib/contests/penalties.ts, no double count).
 */
export const givePenaltySchema = z.object({
  entryId: z.uuid("Not an entry."),
  cause: z.enum(PENALTY_CAUSES, "Choose what the penalty is for."),
  points: z.number("Give the penalty points.").int("Penalties are whole points.").min(0, "Penalties are given as positive points.").max(MAX_OFFICER_PENALTY, `At most ${MAX_OFFICER_PENALTY} points.`),
  note: text(200).trim().max(200, "At most 200 characters.").transform((s) => s || null).nullable().default(null),
  separate: z.boolean().default(false),
}).superRefine((b, ctx) => {
  const fixed = fixedPenaltyPoints(b.cause);
  if (fixed !== null && b.points !== fixed) ctx.addIssue({ code: "custom", path: ["points"], message: `This penalty is ${fixed} points by the rules.` });
  if (b.cause === "other" && b.points === 0) ctx.addIssue({ code: "custom", path: ["points"], message: "Give the penalty points." });
});

/** An officer removes an officer's penalty of the round, saying why (the removal is recorded, the penalty stays listed). */
export const removePenaltySchema = z.object({
  penaltyId: z.uuid("Not a penalty."),
  reason: text(200).trim().min(1, "Say why it is removed."),
});

/** An officer sets aside a penalty the timekeeper's phone gave (its `penalty` event's id), saying why. */
export const setAsidePhonePenaltySchema = z.object({
  eventId: z.uuid("Not a penalty from a phone."),
  reason: text(200).trim().min(1, "Say why it is set aside."),
});

/**
 * An officer resolves an open dispute: upheld or rejected, the outcome in words; an upheld one names
 * the existing action that carries it out (lib/contests/disputes.ts), a rejected one none.
 */
export const resolveDisputeSchema = z.object({
  disputeId: z.uuid("Not a dispute."),
  status: z.enum(["upheld", "rejected"], "Choose upheld or rejected."),
  outcome: text(500).trim().min(1, "Write the outcome."),
  action: z.enum(DISPUTE_ACTIONS, "Choose how the upheld dispute is carried out.").nullable().default(null),
}).refine((b) => (b.status === "upheld") === (b.action !== null), { message: "An upheld dispute names how it is carried out; a rejected one none.", path: ["action"] });
