/** A timed run's lane an officer can link to a pilot's slot (db/queries/contest-lanes listLinkableLanes). */
export type LinkableLane = { runId: string; lane: number; pilotName: string; resultTenths: number | null; startedAt: string; taskLetter: string | null };
