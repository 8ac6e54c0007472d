import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import { clockEstimateSchema, REFLIGHT_CAUSES, REFLIGHT_PLACEMENTS, runEventSchema } from "@/lib/events/schema";
import { runDiscardSchema, runEntitySchema, sessionEntitySchema } from "@/lib/events/entities";
import { EPOCH_MS_MAX, text } from "./bounds";
import { laneConsentSchema, recorderSchema } from "./consent";
import { pulledNoteSchema, pulledPlanSchema } from "./coaching-sync";
import { pulledDutySchema } from "./contest-sync";
import { MODEL_STATUSES } from "./hangar";

export { clockEstimateSchema };

/**
 * The sync protocol between a device and the server (SYNC.md §3). One schema per message,
 * parsed by the route handlers before any I/O and by the sync client on every reply.
 */

/** Most items one push may carry (the client sends at most PUSH_BATCH_SIZE). */
export const PUSH_MAX_ITEMS = 500;
/** Batch size the sync client uses. */
export const PUSH_BATCH_SIZE = 200;

/** Most clock estimates one push may carry (the device keeps at most 32 bursts). */
export const PUSH_MAX_CLOCK_ESTIMATES = 64;

// POST /api/sync/push — body
export const pushRequestSchema = lazySchema(() => z
  .object({
    deviceId: text(64).min(1),
    /** The account whose device database this is (see device-user.ts); refused if not the session's. */
    account: z.string().uuid().optional(),
    sessions: z.array(sessionEntitySchema).max(PUSH_MAX_ITEMS),
    runs: z.array(runEntitySchema).max(PUSH_MAX_ITEMS),
    events: z.array(runEventSchema).max(PUSH_MAX_ITEMS),
    /**
     * The device's offset measurements (oldest first). Optional: the server stores them and
     * re-corrects this device's events between the estimates before and after an offline period.
     */
    clockEstimates: z.array(clockEstimateSchema).max(PUSH_MAX_CLOCK_ESTIMATES).optional(),
    /** Unstarted windows the device deleted (acked by the run's id). Optional: most pushes carry none. */
    discards: z.array(runDiscardSchema).max(PUSH_MAX_ITEMS).optional(),
  })
  .refine((r) => r.sessions.length + r.runs.length + r.events.length + (r.discards?.length ?? 0) <= PUSH_MAX_ITEMS, {
    message: `at most ${PUSH_MAX_ITEMS} items per push`,
  }));
export type PushRequest = z.infer<typeof pushRequestSchema>;

/** The server's verdict on one pushed item, by its id. */
export const ackSchema = lazySchema(() => z.object({
  id: z.string().min(1),
  status: z.enum(["applied", "duplicate", "rejected"]),
  reason: z.string().max(500).optional(),
}));
export type Ack = z.infer<typeof ackSchema>;

// POST /api/sync/push — reply
export const pushReplySchema = lazySchema(() => z.object({
  acks: z.array(ackSchema),
  serverSeq: z.number().int().nonnegative(),
}));
export type PushReply = z.infer<typeof pushReplySchema>;

/** Most items one pull page may carry; the default page size. */
export const PULL_MAX_LIMIT = 1000;
export const PULL_DEFAULT_LIMIT = 500;

const XID8_MAX = (1n << 64n) - 1n;
const BIGINT_MAX = (1n << 63n) - 1n;

/**
 * A pull position: "<xid>.<seq>" — the transaction id and server sequence number of the last row
 * served (db/queries/sync-pull.ts). A bare number is a position from before transaction ids and
 * counts as "<0>.<seq>" (so such a device gets everything again, once). "0" is the start.
 */
const CURSOR = /^\d{1,20}(\.\d{1,19})?$/;
export const pullCursorSchema = lazySchema(() => z.string().refine((c) => {
  if (!CURSOR.test(c)) return false;
  const [a, b] = c.split(".");
  return b === undefined ? BigInt(a!) <= BIGINT_MAX : BigInt(a!) <= XID8_MAX && BigInt(b) <= BIGINT_MAX;
}, "a cursor is <xid>.<seq> (or a number) within range"));
export type PullCursor = { xid: string; seq: string };

/** The position a cursor names (validated by pullCursorSchema). */
export function readPullCursor(c: string): PullCursor {
  const [a, b] = c.split(".");
  return b === undefined ? { xid: "0", seq: String(BigInt(a!)) } : { xid: String(BigInt(a!)), seq: String(BigInt(b)) };
}

/** Whether cursor `a` lies after cursor `b` (both valid pull cursors). */
export function cursorAfter(a: string, b: string): boolean {
  const [x, y] = [readPullCursor(a), readPullCursor(b)];
  return BigInt(x.xid) > BigInt(y.xid) || (BigInt(x.xid) === BigInt(y.xid) && BigInt(x.seq) > BigInt(y.seq));
}

// GET /api/sync/pull?cursor=C&limit=N&total=1 — query
export const pullQuerySchema = lazySchema(() => z.object({
  cursor: pullCursorSchema.default("0"),
  /** Items per page (the last page may hold fewer; a coach's copy may hold fewer still). */
  limit: z.coerce.number().int().min(1).max(PULL_MAX_LIMIT).default(PULL_DEFAULT_LIMIT),
  /** "1": also say about how many items remain after the cursor (the phone's progress). */
  total: z.enum(["0", "1"]).optional(),
  /** As in a push: the account whose device database asks. */
  account: z.string().uuid().optional(),
  /**
   * The `coaching` fingerprint of the notes and plans the device holds (pullReplySchema.coaching):
   * when it still matches, the last page leaves them out. Absent (an older phone, or none held yet): sent whole.
   */
  coaching: z.string().regex(/^[0-9a-f]{64}$/, "a coaching fingerprint is 64 hex digits").optional(),
}));
export type PullQuery = z.infer<typeof pullQuerySchema>;

const seq = z.number().int().positive();

/** One device's account of a lane, as the server derived it (every version is kept; SYNC.md §3). */
export const laneVersionSchema = lazySchema(() => z.object({
  deviceId: z.string(),
  /** Recorded by a timekeeper a contest assigned to the run (lib/sync/sources.ts). */
  official: z.boolean(),
  /** The version the official result uses. */
  chosen: z.boolean(),
  resultTenths: z.number().int(),
}));

/** A ruling recorded for the lane that does not count (lib/results RulingNote). */
export const rulingNoteSchema = lazySchema(() => z.object({
  kind: z.enum(["penalty", "invalid", "unsigned", "reflight"]),
  reflight: z.object({ cause: z.enum(REFLIGHT_CAUSES), placement: z.enum(REFLIGHT_PLACEMENTS) }).optional(),
  recordedBy: z.string().max(64),
  points: z.number().int().nullable(),
  flightIndex: z.number().int().nullable(),
  reason: z.string().max(200),
}));

/** The server's result for one lane of a run (derived from every device's events). */
export const laneResultSchema = lazySchema(() => z.object({
  lane: z.number().int().min(0).max(3),
  resultTenths: z.number().int().nullable(),
  penaltyPoints: z.number().int().nonnegative(),
  /** The clocks cannot settle a launch or landing against a signal given on another device. */
  needsReview: z.boolean(),
  reviewReason: z.string().nullable(),
  versions: z.array(laneVersionSchema),
  /** Rulings that do not count: a non-official's penalties and invalid marks. */
  notes: z.array(rulingNoteSchema).optional(),
}));
export type LaneResult = z.infer<typeof laneResultSchema>;

/** One changed record, tagged with the server sequence number it was assigned. */
export const pullItemSchema = lazySchema(() => z.discriminatedUnion("type", [
  z.object({ type: z.literal("event"), seq, data: runEventSchema }),
  z.object({ type: z.literal("session"), seq, data: sessionEntitySchema }),
  z.object({
    type: z.literal("run"),
    seq,
    data: runEntitySchema,
    /** The run's session when the user does not own it (a timekeeper's session they fly in). */
    session: sessionEntitySchema.optional(),
    /** The server's derived results per lane (absent before the first derivation). */
    results: z.array(laneResultSchema).optional(),
    /** Who created the run, so a pilot it was recorded for sees "recorded by …". */
    recordedBy: recorderSchema.optional(),
    /** Each named pilot's lane: counted as their own, pending their decision, or decided. */
    consents: z.array(laneConsentSchema).optional(),
  }),
]));
export type PullItem = z.infer<typeof pullItemSchema>;

/** A model as the phone keeps it for the lane's picker. */
export const pulledModelSchema = lazySchema(() => z.object({ id: z.string().uuid(), name: z.string().min(1).max(500), status: z.enum(MODEL_STATUSES) }));
export type PulledModel = z.infer<typeof pulledModelSchema>;

// GET /api/sync/pull — reply
export const pullReplySchema = lazySchema(() => z.object({
  items: z.array(pullItemSchema),
  /** Where the next page starts; the same position when nothing was served. */
  nextCursor: pullCursorSchema,
  /** More items are ready after this page. */
  hasMore: z.boolean(),
  /** About how many items were ready after the asked cursor, this page included (only when asked: `total=1`). */
  total: z.number().int().nonnegative().optional(),
  /**
   * Runs the device may hold as a coach's copy but may no longer see (a coach grant revoked, a
   * lane the pilot hid or disputed): ids only, on the first page of a pull from the start — which
   * every change of `scope` leads to; and, on any page, unstarted windows their recorder deleted
   * after the cursor (db/queries/run-discard.ts). The device drops them with their events.
   */
  forget: z.array(z.string().uuid()).max(10_000).optional(),
  /**
   * Lanes lost from runs the device still sees as a coach's copy (a pilot hid or disputed their
   * lane, or revoked the grant while another pilot's lane keeps the run visible), on the same
   * first page: the run's row comes again with only the lanes it may see, and the device drops
   * the lost lanes' events (lib/offline/forget.ts forgetLanes).
   */
  forgetLanes: z.array(z.object({ runId: z.string().uuid(), lanes: z.array(z.number().int().min(0).max(32_767)).max(1_000) })).max(10_000).optional(),
  /**
   * Fingerprint of what the user may see beyond their own records (their active coach grants).
   * When it changes, rows below the cursor may have become visible: the device pulls from 0 again.
   */
  scope: z.string().max(64).optional(),
  /**
   * The user's hangar as it is now (their own models, sold and retired ones too), on the last
   * page of every pull: a second phone of the same pilot offers the same models on the field,
   * offline. A whole list each time, so a model sold or deleted drops off the phone.
   */
  models: z.array(pulledModelSchema).max(10_000).optional(),
  /**
   * Fingerprint of the coach notes and practice plans the user may read now (lib/coach/fingerprint.ts),
   * on the last page of every pull. The device keeps it with the lists and sends it back as the
   * pull's `coaching` parameter: while it matches, `notes` and `plans` are left out.
   */
  coaching: z.string().max(64).optional(),
  /**
   * Coach notes and their answers the user may read now (as the pilot, or as the coach while the
   * pilot's grant holds), on the last page of a pull whose `coaching` fingerprint did not match (or
   * was not sent): a whole list, so a revoked coach's phone drops that pilot's notes at its next
   * pull (db/queries/coach/notes.ts).
   */
  notes: z.array(pulledNoteSchema).max(5_000).optional(),
  /** Practice plans assigned to the user, with their progress, beside `notes` (same rule; the Field shows them offline). */
  plans: z.array(pulledPlanSchema).max(1_000).optional(),
  /** Contest groups the user keeps time for, with the pilots to time, on the last page of every pull (the Field shows them offline). */
  contestDuties: z.array(pulledDutySchema).max(1_000).optional(),
}));
export type PullReply = z.infer<typeof pullReplySchema>;

// POST /api/time — body: the device's send time T1
export const timeRequestSchema = lazySchema(() => z.object({ t1: z.number().finite().min(-EPOCH_MS_MAX).max(EPOCH_MS_MAX) }));
export type TimeRequest = z.infer<typeof timeRequestSchema>;

// POST /api/time — reply: T1 echoed, server receive time T2 and send time T3
export const timeReplySchema = lazySchema(() => z.object({ t1: z.number(), t2: z.number(), t3: z.number() }));
export type TimeReply = z.infer<typeof timeReplySchema>;
