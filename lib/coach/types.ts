/** What the coach routes answer (shared by db/queries/coach and the screens). */

/** One line of "who can see my season" in Settings. */
export type PilotGrantRow =
  | { id: string; kind: "grant"; coachName: string; coachEmail: string; createdAt: string }
  | { id: string; kind: "email"; email: string; createdAt: string; expiresAt: string }
  | { id: string; kind: "code"; createdAt: string; expiresAt: string };

/** One pilot of a coach's roster. */
export type RosterPilot = {
  pilotId: string;
  name: string;
  /** start of the latest field session with a run that counts in the pilot's record; null if none */
  lastSessionAt: string | null;
  runsThisMonth: number;
  /** mean result as a share of the task's maximum (0..1): the last 30 days, and the 30 before */
  result: { recent: number | null; before: number | null };
  /** median ground time from a landing to the next launch, in seconds: the last 30 days, and the 30 before */
  turnaround: { recent: number | null; before: number | null };
};
