import { z } from "zod";
import { OFFICER_DEVICE_PREFIX, runEventSchema } from "@/lib/events/schema";
import { runDiscardSchema, runEntitySchema, sessionEntitySchema } from "@/lib/events/entities";
import { textProblem } from "./bounds";
import { clockEstimateSchema, PUSH_MAX_CLOCK_ESTIMATES, PUSH_MAX_ITEMS, pushRequestSchema, type Ack, type PushRequest } from "./sync";

/**
 * How the server reads a push (SYNC.md §3 "per-item verdicts"): the envelope strictly — device,
 * account, arrays and their lengths — and then every session, run and event on its own. An item
 * that fails its schema is refused with the reason and the rest of the batch applies, so one
 * bad item never blocks a device's outbox.
 */

/** The envelope: items stay opaque here and are parsed one by one. */
export const pushEnvelopeSchema = z
  .object({
    // device ids under OFFICER_DEVICE_PREFIX are the server's (an officer's set-aside of a phone's penalty): no phone pushes as one
    deviceId: pushRequestSchema.shape.deviceId.refine((id) => !id.startsWith(OFFICER_DEVICE_PREFIX), "This device id is reserved for the server."),
    account: pushRequestSchema.shape.account,
    sessions: z.array(z.unknown()).max(PUSH_MAX_ITEMS),
    runs: z.array(z.unknown()).max(PUSH_MAX_ITEMS),
    events: z.array(z.unknown()).max(PUSH_MAX_ITEMS),
    clockEstimates: z.array(z.unknown()).max(PUSH_MAX_CLOCK_ESTIMATES).optional(),
    discards: z.array(z.unknown()).max(PUSH_MAX_ITEMS).optional(),
  })
  .refine((r) => r.sessions.length + r.runs.length + r.events.length + (r.discards?.length ?? 0) <= PUSH_MAX_ITEMS, {
    message: `at most ${PUSH_MAX_ITEMS} items per push`,
  });
export type PushEnvelope = z.infer<typeof pushEnvelopeSchema>;

/** Longest item id the server will name in a refusal (ids are UUIDs; this leaves room). */
export const MAX_ITEM_ID = 64;

/** The id an item can be refused by: a string the database can hold, or null. */
export function usableItemId(item: unknown): string | null {
  if (typeof item !== "object" || item === null || !("id" in item)) return null;
  const { id } = item as { id: unknown };
  if (typeof id !== "string" || id.length === 0 || id.length > MAX_ITEM_ID || textProblem(id)) return null;
  return id;
}

/** An item with no id the device could match a verdict to: the only per-item fault that fails the batch. */
export class UnnamedItemError extends Error {
  constructor(readonly path: string) {
    super(`${path}: an item needs an id (a string of at most ${MAX_ITEM_ID} characters)`);
  }
}

function readItems<T>(schema: z.ZodType<T>, kind: string, items: readonly unknown[], refused: Ack[]): T[] {
  const ok: T[] = [];
  items.forEach((item, i) => {
    const parsed = schema.safeParse(item);
    if (parsed.success) return void ok.push(parsed.data);
    const id = usableItemId(item);
    if (id === null) throw new UnnamedItemError(`${kind}s.${i}`);
    const issue = parsed.error.issues[0];
    const where = issue?.path.length ? `${issue.path.join(".")}: ` : "";
    const reason = `Invalid ${kind}: ${where}${issue?.message ?? "does not match the protocol"}`.slice(0, 500);
    refused.push({ id, status: "rejected", reason: textProblem(reason) ? `Invalid ${kind}.` : reason });
  });
  return ok;
}

/**
 * Split a push into what parsed (typed, unknown fields stripped) and refusals for the items
 * that did not. Clock estimates are not outbox items: invalid ones are dropped, never stored.
 * Throws UnnamedItemError for an item without a usable id.
 */
export function readPush(envelope: PushEnvelope): { request: PushRequest; refused: Ack[] } {
  const refused: Ack[] = [];
  const request: PushRequest = {
    deviceId: envelope.deviceId,
    ...(envelope.account ? { account: envelope.account } : {}),
    sessions: readItems(sessionEntitySchema, "session", envelope.sessions, refused),
    runs: readItems(runEntitySchema, "run", envelope.runs, refused),
    events: readItems(runEventSchema, "event", envelope.events, refused),
    clockEstimates: (envelope.clockEstimates ?? []).flatMap((e) => {
      const parsed = clockEstimateSchema.safeParse(e);
      return parsed.success ? [parsed.data] : [];
    }),
  };
  if (envelope.discards?.length) request.discards = readItems(runDiscardSchema, "deletion", envelope.discards, refused);
  return { request, refused };
}

/**
 * Growth caps per account, generous for any real field day and refused per item with a reason
 * beyond them: events in one run (a 10-minute window with 4 lanes is a few hundred taps) and
 * runs one account creates per day (by the day the device says each run was created).
 */
export const MAX_EVENTS_PER_RUN = 20_000;
export const MAX_RUNS_PER_DAY = 200;
