import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";

/**
 * A timekeeper's contest duties as a pull carries them (pullReplySchema.contestDuties): a whole list
 * on the last page of every pull, so an assignment the officer changes or removes drops off the phone
 * at its next pull (db/queries/contest-timekeepers.ts dutiesOf).
 */
export const pulledDutySchema = lazySchema(() => z.object({
  contestId: z.uuid(),
  /** The contest's club, only when the timekeeper is one of its members: the duty's session belongs to it. */
  clubId: z.uuid().optional(),
  contestName: z.string().max(500),
  fieldName: z.string().max(500),
  startsOn: z.string().max(10),
  roundId: z.uuid(),
  roundNumber: z.number().int(),
  /** A fly-off round (its own numbering); absent in pulls from servers before fly-offs. */
  flyOff: z.boolean().optional(),
  groupNumber: z.number().int(),
  /** A re-flight's duty: the grant (contest_reflights.id) and its one pilot; absent on a group's duty and in pulls from older servers. */
  reflightId: z.uuid().optional(),
  task: z.record(z.string(), z.unknown()),
  pilots: z.array(z.object({ entryId: z.uuid(), name: z.string().max(500) })).min(1).max(30),
}));
export type PulledDuty = z.infer<typeof pulledDutySchema>;
