/**
 * Timekeepers on the contest day (issue 15, "On the day"): an officer gives each pilot of a group a
 * timekeeper, whose phone then times that pilot's lane. Pure rules, no framework.
 */

/** A phone's field timer holds at most four lanes (lib/events/entities.ts runLaneSchema), so one timekeeper times at most four pilots of a group. */
export const MAX_PILOTS_PER_TIMEKEEPER = 4;

export type DrawnPilot = { entryId: string; pilotUserId: string | null };
export type TimekeeperChoice = { entryId: string; timekeeperUserId: string | null };

/**
 * Why a group's timekeeper choices cannot be saved, or null. `group` is every pilot drawn in the
 * group; `eligible` the accounts that may keep time at this contest (the club's members and the
 * contest's entered pilots). Refused: a pilot not in the group (or named twice); a timekeeper who
 * is not eligible; a timekeeper who flies in that group (a pilot cannot time their own group's
 * window while flying it — common practice, and F3K.9.1 has every pilot of a group fly together);
 * more than four pilots for one timekeeper, counting `kept` (what stays stored for the group's pilots the
 * choices do not name).
 */
export function timekeeperProblem(
  group: readonly DrawnPilot[], eligible: ReadonlySet<string>, choices: readonly TimekeeperChoice[], kept: readonly TimekeeperChoice[] = [],
): string | null {
  const drawn = new Set(group.map((p) => p.entryId));
  const flying = new Set(group.flatMap((p) => (p.pilotUserId ? [p.pilotUserId] : [])));
  const seen = new Set<string>();
  const count = new Map<string, number>();
  for (const c of choices) {
    if (!drawn.has(c.entryId) || seen.has(c.entryId)) return "A pilot named is not drawn in this group (or is named twice).";
    seen.add(c.entryId);
    if (c.timekeeperUserId === null) continue;
    if (!eligible.has(c.timekeeperUserId)) return "A timekeeper must be a member of the club or a pilot entered in the contest.";
    if (flying.has(c.timekeeperUserId)) return "This timekeeper flies in this group: choose someone who does not.";
    count.set(c.timekeeperUserId, (count.get(c.timekeeperUserId) ?? 0) + 1);
  }
  // the whole group after the change: choices replace what is stored for the pilots they name
  for (const k of kept) if (k.timekeeperUserId !== null && !seen.has(k.entryId)) count.set(k.timekeeperUserId, (count.get(k.timekeeperUserId) ?? 0) + 1);
  if ([...count.values()].some((n) => n > MAX_PILOTS_PER_TIMEKEEPER)) return `One timekeeper times at most ${MAX_PILOTS_PER_TIMEKEEPER} pilots of a group (a phone holds four lanes).`;
  return null;
}

/**
 * Why this account cannot time a re-flight, or null: the same rules as a group's timekeeper
 * ({@link timekeeperProblem}): eligible (a club member or an entered pilot with an account) and not
 * flying in the group the re-flight is flown in. `flying` holds the accounts of every pilot flying in
 * that group: the group's drawn pilots and the pilots re-flying in it, the re-flyer included.
 * A re-flight is one pilot, so the four-lane limit cannot be reached.
 */
export function reflightTimekeeperProblem(timekeeperUserId: string, eligible: ReadonlySet<string>, flying: ReadonlySet<string>): string | null {
  if (!eligible.has(timekeeperUserId)) return "A timekeeper must be a member of the club or a pilot entered in the contest.";
  if (flying.has(timekeeperUserId)) return "This timekeeper flies in the group the re-flight is flown in: choose someone who does not.";
  return null;
}

/** A timekeeper's duty as the phone keeps it: one round's group and the pilots to time there, or one pilot's re-flight. */
export type ContestDuty = {
  contestId: string; contestName: string; fieldName: string; startsOn: string;
  roundId: string; roundNumber: number; groupNumber: number;
  /** A re-flight grant (contest_reflights.id) this duty times: one pilot, flown in `groupNumber`; absent on a group's duty and from older servers. */
  reflightId?: string;
  /** A fly-off round (numbered apart from the preliminary ones); absent from phones synced before fly-offs: false. */
  flyOff?: boolean;
  task: Record<string, unknown>;
  pilots: { entryId: string; name: string }[];
};

/**
 * "round N, group G — pilots A, B, C" ("fly-off round N, …"), or for a re-flight "re-flight, round N,
 * group G — pilot X": the duty as the Field shows it (after "Contest: ").
 */
export function dutyText(d: Pick<ContestDuty, "roundNumber" | "groupNumber" | "pilots" | "flyOff" | "reflightId">): string {
  if (d.reflightId) return `re-flight, ${dutyRound(d)}, group ${d.groupNumber} — pilot ${d.pilots[0]?.name ?? ""}`;
  return `${dutyRound(d)}, group ${d.groupNumber} — pilots ${d.pilots.map((p) => p.name).join(", ")}`;
}

/** Where a duty's run links on push: the round, each lane's entry, and the re-flight grant when the duty is one (RunEntity.contest). */
export function dutyContest(d: Pick<ContestDuty, "roundId" | "pilots" | "reflightId">): { roundId: string; slots: { lane: number; entryId: string }[]; reflightId?: string } {
  return { roundId: d.roundId, slots: dutyLanes(d).slots, ...(d.reflightId ? { reflightId: d.reflightId } : {}) };
}

/** "round N" or "fly-off round N". */
export function dutyRound(d: Pick<ContestDuty, "roundNumber" | "flyOff">): string {
  return `${d.flyOff ? "fly-off round" : "round"} ${d.roundNumber}`;
}

/** The lanes a duty's window gets: one per pilot, in the duty's order, named, each tied to the pilot's entry. */
export function dutyLanes(d: Pick<ContestDuty, "pilots">): { lanes: { lane: number; pilotName: string }[]; slots: { lane: number; entryId: string }[] } {
  const pilots = d.pilots.slice(0, MAX_PILOTS_PER_TIMEKEEPER);
  return {
    lanes: pilots.map((p, lane) => ({ lane, pilotName: p.name })),
    slots: pilots.map((p, lane) => ({ lane, entryId: p.entryId })),
  };
}
