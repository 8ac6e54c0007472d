import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import { durationMs, epochMs, int4, MAX_DELAY_MS, MAX_OFFSET_MS, text } from "./bounds";

/**
 * The append-only event log of the flight line (SYNC.md §1).
 *
 * Every tap is one event. Flights, results and scores are derived from a run's
 * events by the task engine (`lib/tasks`), the same code on phone and server.
 * A correction or an undo is a new event that names the one it supersedes;
 * nothing is edited or deleted in place.
 *
 * A *run* is one task window timed on the line: one task, 1–4 *lanes* (a lane is
 * one pilot). A solo practice run has one lane.
 */

/**
 * A device's clock offset estimate (lib/clock ClockEstimate): θ = server time − device time,
 * δ the round trip of the exchange it came from, and when (device wall time) it was measured.
 */
export const clockEstimateSchema = lazySchema(() => z.object({
  thetaMs: z.number().finite().min(-MAX_OFFSET_MS).max(MAX_OFFSET_MS),
  deltaMs: z.number().finite().min(0).max(MAX_DELAY_MS),
  measuredAtWallMs: epochMs,
}));

/** When and where an event was recorded, kept raw so the server can re-correct it later (SYNC.md §4). */
export const stampSchema = lazySchema(() => z.object({
  /** Device wall clock (ms since the Unix epoch) at the input event's own timestamp. */
  wallMs: epochMs,
  /** Monotonic time (performance.timeOrigin-relative ms) of the input event. */
  monoMs: durationMs,
  /** Id of the page lifetime the monotonic time belongs to (a reload starts a new one). */
  pageId: text(64).min(1),
  /** The device's best offset estimate at that moment (server time − device time), if any. */
  offset: clockEstimateSchema.nullable(),
}));
export type Stamp = z.infer<typeof stampSchema>;

const lane = z.number().int().min(0).max(3);

/** Why a flight is marked invalid (F3K.6.2 landing outside the field, F3K.2.2 a lost part, F3K.4.4 airspace). */
export const invalidReasonSchema = lazySchema(() => z.enum(["landing-outside-field", "part-lost", "forbidden-airspace", "other"]));
export type InvalidReason = z.infer<typeof invalidReasonSchema>;
/** What a penalty was given for (RULES.md "Penalties"); "launch-contact" also zeroes the round. */
export const PENALTY_CAUSES = [
  "object-in-safety-area", // −100, F3K.4.3
  "person-in-safety-area", // −300, F3K.4.3
  "person-outside-safety-area", // −100, F3K.4.3
  "outside-time", // −100, F3K.9.5: launching or flying outside the group's windows
  "relaunch-outside-field", // −100, F3K.2.4
  "launch-contact", // round scores 0 plus the penalty, F3K.4.1
  "other",
] as const;
export type PenaltyCause = (typeof PENALTY_CAUSES)[number];

/** The grounds for a re-flight, and only these (F3K.9.6: organiser's fault; F3K.4.2: a collision during a launch; an outsider moving the model; F3K.5: rain). */
export const REFLIGHT_CAUSES = ["organiser", "launch-collision", "outsider-moved-model", "rain"] as const;
export type ReflightCause = (typeof REFLIGHT_CAUSES)[number];
/** Where the re-flight is flown (F3K.9.6), which decides which result stands (lib/scoring/reflight.ts). */
export const REFLIGHT_PLACEMENTS = ["later-group", "new-group", "original-group"] as const;
export type ReflightPlacement = (typeof REFLIGHT_PLACEMENTS)[number];

/** What happened, by kind. Times of timed kinds are in the envelope's `stamp`. */
export const eventBodySchema = lazySchema(() => z.discriminatedUnion("kind", [
  /** The working-time start signal (for task C: the launch signal of the next attempt). */
  z.object({ kind: z.literal("window-start") }),
  /** A model left the hand. */
  z.object({ kind: z.literal("launch"), lane }),
  /** A model came to rest or was caught. */
  z.object({ kind: z.literal("landing"), lane }),
  /** Task E (or a custom "call your target" task): the target announced before the next launch. */
  z.object({ kind: z.literal("target"), lane, targetSec: z.number().int().min(1).max(3600) }),
  /** Task E: the pilot calls "end of working time" — one attempt only follows. */
  z.object({ kind: z.literal("end-call"), lane }),
  /**
   * A flight scores zero (landing outside the field, a lost part, forbidden airspace). The flight
   * is named by its launch event's id (`flightId`), so an undo of another flight cannot move the
   * mark. Events recorded before that named it by position (`flightIndex`, 0-based in the lane's
   * flights when the mark was recorded) are still read: the engine maps them once to a launch.
   */
  z
    .object({
      kind: z.literal("invalid"),
      lane,
      flightId: z.string().uuid().optional(),
      flightIndex: z.number().int().min(0).max(99).optional(),
      reason: invalidReasonSchema,
    })
    .refine((b) => b.flightId !== undefined || b.flightIndex !== undefined, "an invalid mark names its flight (flightId)"),
  /**
   * A penalty in points against the lane's pilot for this round (F3K.4.3, F3K.9.5). `cause`,
   * `launchId` (the launch event of the attempt it happened in) and `midAir` feed the rules of
   * lib/tasks/penalty-rules.ts; events recorded before they existed have none and count in full.
   */
  z.object({
    kind: z.literal("penalty"),
    lane,
    points: z.number().int().min(1).max(1000),
    reason: text(200).min(1),
    cause: z.enum(PENALTY_CAUSES).optional(),
    launchId: z.string().uuid().optional(),
    midAir: z.boolean().optional(),
  }),
  /** The round result was not signed by pilot and timekeeper: the round scores zero (F3K.1.2). */
  z.object({ kind: z.literal("unsigned"), lane }),
  /**
   * Pilot and timekeeper signed the lane's result on the timekeeper's phone (F3K.1.2: an unsigned
   * result scores zero). Scoring ignores it; for a contest run the server marks the pilot's slot signed
   * (db/queries/contest-timekeepers.ts signLanes).
   */
  z.object({ kind: z.literal("signed"), lane }),
  /** The lane's pilot is granted a re-flight of this round (F3K.9.6, F3K.4.2). */
  z.object({
    kind: z.literal("reflight"),
    lane,
    cause: z.enum(REFLIGHT_CAUSES),
    placement: z.enum(REFLIGHT_PLACEMENTS),
    reason: text(200).optional(),
  }),
  /** Moves a timed event to another time (ms on the same clock as its stamp). */
  z.object({ kind: z.literal("correct"), targetId: z.string().uuid(), wallMs: epochMs }),
  /**
   * Undo: the named event no longer counts. With `setAside` it is an officer's decision, not a phone's
   * undo: an officer of the contest's club set a timekeeper's penalty aside on the round page, with why
   * (db/queries/contest-phone-set-aside.ts). The server authors it (device `officer:<penalty's id>`,
   * recordedBy the officer, stamped with the server's clock) and phones pull it like any event; a push
   * carrying `setAside`, or amending such an event, is refused (lib/sync/authorise.ts). It is a `void`
   * rather than a kind of its own so a phone from before it folds it as the undo it is (zod strips the
   * unknown key) instead of failing every pull on an unknown kind.
   */
  z.object({
    kind: z.literal("void"),
    targetId: z.string().uuid(),
    /** `by`: the officer's name when they decided, so a phone shows who offline (recordedBy is their account). */
    setAside: z.object({ reason: text(200).min(1), by: text(200).optional() }).optional(),
  }),
  /**
   * The lane flies this model (a hangar model's id) from now on: picked before the window, or a
   * swap mid-window. Scoring ignores it; launch heights and the hangar's per-model figures read it.
   */
  z.object({ kind: z.literal("model"), lane, modelId: z.string().uuid() }),
  /** The run was closed by its timekeeper (after the landing window). */
  z.object({ kind: z.literal("run-end") }),
]));
export type EventBody = z.infer<typeof eventBodySchema>;
export type EventKind = EventBody["kind"];

/** The device id of the event an officer's set-aside of a phone's penalty is stored under (one per penalty: a second is refused by (device, seq)). */
export const OFFICER_DEVICE_PREFIX = "officer:";
export const officerDeviceId = (penaltyEventId: string) => `${OFFICER_DEVICE_PREFIX}${penaltyEventId}`;

/** One event as stored on the device, pushed to the server and pulled back. */
export const runEventSchema = lazySchema(() => z.object({
  id: z.string().uuid(), // UUIDv7, client-generated
  runId: z.string().uuid(),
  deviceId: text(64).min(1),
  /** Per-device sequence number, strictly increasing from 1 (a PostgreSQL integer). */
  seq: int4(1),
  /** The signed-in user who recorded it (filled by the server from the session). */
  recordedBy: text(64).optional(),
  stamp: stampSchema,
  body: eventBodySchema,
}));
export type RunEvent = z.infer<typeof runEventSchema>;
