import Dexie, { type EntityTable, type Table } from "dexie";
import type { ClockEstimate, TimeSample } from "@/lib/clock";
import type { RunEvent } from "@/lib/events/schema";
import type { PracticePlan } from "@/lib/field/practice-plan";
import type { PilotGrantRow } from "@/lib/coach/types";
import type { LaneConsent } from "@/lib/validations/consent";
import type { LaneResult, PulledModel } from "@/lib/validations/sync";
import type { PulledNote, PulledPlan } from "@/lib/validations/coaching-sync";
import type { PulledDuty } from "@/lib/validations/contest-sync";
import { BASE_DB_NAME, currentDbName } from "./device-user";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";

/**
 * A run as kept on the device: the entity plus, once pulled, the server's derived results, who
 * recorded it and each named pilot's consent (lib/sync/consent.ts).
 */
export type StoredRun = RunEntity & { results?: LaneResult[]; recordedBy?: { id: string; name: string }; consents?: LaneConsent[] };

/**
 * The device's IndexedDB database (SYNC.md §2), one per account signed in here; browser only.
 */

/**
 * What an outbox entry stands for; its id is the id of that event, session or run. "discard":
 * the deletion of an unstarted run (its id), which has no record left on the device.
 */
export type OutboxKind = "event" | "session" | "run" | "discard";

/** One item not yet acknowledged by the server. */
export type OutboxEntry = {
  id: string;
  kind: OutboxKind;
  /** Device wall time it was queued (for display). */
  createdAt: number;
  /**
   * Local, strictly increasing queue position, allocated in the writing transaction:
   * sends follow it, so a run always goes before its events even if the wall clock
   * was stepped back in between.
   */
  queueSeq: number;
  /** Failed push attempts so far. */
  attempts: number;
  lastError?: string;
  /** Set when the server (or the device's own validation) refused it: kept, never resent. */
  rejected?: { reason: string };
};

/** One /api/time exchange kept for the clock filter, grouped by measurement burst. */
export type ClockSampleRow = TimeSample & { id: number; burstId: number };

/** Typed values of the `meta` table. */
export type MetaValues = {
  deviceId: string;
  /** The seq the next recorded event gets (per device, from 1). */
  nextSeq: number;
  /** The queueSeq the next outbox entry gets. */
  nextQueueSeq: number;
  /** The pull position reached ("<xid>.<seq>"; a number from before transaction ids, sent as is). */
  pullCursor: string | number;
  /** The server's visibility fingerprint at that cursor (see pullReplySchema.scope). */
  pullScope: string;
  /** The fingerprint of the `notes` and `assignedPlans` below as the last pull sent them (pullReplySchema.coaching), sent back on each pull. */
  pullCoaching: string;
  /** Id of the last clock measurement burst. */
  clockBurst: number;
  /** The offset estimate of the latest successful burst. */
  clockEstimate: ClockEstimate;
  /** measuredAtWallMs of the newest clock estimate the server has acknowledged receiving. */
  clockSentAt: number;
  /** The signed-in user, cached while online so offline pages know who is timing. */
  profile: { id: string; name: string; email: string };
  /** People who share a club with that user, cached while online (lanes can name them offline). */
  clubMates: { id: string; name: string }[];
  /** That user's models (their hangar), as the last pull or /api/models gave them: the lanes offer them offline. */
  models: PulledModel[];
  /** Coach notes and answers that user may read (as pilot or coach), as the last pull gave them: the run page shows them offline. */
  notes: PulledNote[];
  /** Practice plans coaches assigned to that user, with progress, as the last pull gave them: the Field shows them offline. */
  assignedPlans: PulledPlan[];
  /** Contest groups that user keeps time for, with the pilots, as the last pull gave them: the Field offers their lanes offline. */
  contestDuties: PulledDuty[];
  /** Who can see that user's season (Settings' list of coaches and offers), as last fetched and when (ms): Settings shows it offline with its age. */
  coachGrants: { grants: PilotGrantRow[]; fetchedAtMs: number };
  /** The fields of that user's clubs with their cautions, cached while online (the set-up form shows them offline). */
  clubFields: {
    id: string; name: string; clubName: string; latitude: number | null; longitude: number | null;
    launchDirection: string | null; safetyAreas: string | null; localRules: string | null;
  }[];
};
export type MetaKey = keyof MetaValues;
export type MetaRow = { key: MetaKey; value: MetaValues[MetaKey] };

export type WindowcallDb = Dexie & {
  events: Table<RunEvent, string>;
  outbox: Table<OutboxEntry, string>;
  sessions: Table<SessionEntity, string>;
  runs: Table<StoredRun, string>;
  meta: Table<MetaRow, MetaKey>;
  clockSamples: EntityTable<ClockSampleRow, "id">;
  /** The pilot's own practice plans (device only for now; not synced). */
  plans: Table<PracticePlan, string>;
};

/** Open (lazily, on first use) a Windowcall database; tests pass their own name. */
export function createWindowcallDb(name: string = BASE_DB_NAME): WindowcallDb {
  const db = new Dexie(name) as WindowcallDb;
  // Schema history. Old versions are never edited: a change adds
  // db.version(n + 1).stores({...changed tables only}).upgrade(tx => ...) below.
  db.version(1).stores({
    events: "id, runId, [deviceId+seq]",
    outbox: "id, queueSeq, kind",
    sessions: "id, ownerId, startedAtWallMs",
    runs: "id, sessionId",
    meta: "key",
    clockSamples: "++id, burstId",
  });
  // Version 2: the pilot's practice plans (old versions are never edited).
  db.version(2).stores({
    plans: "id, createdAtWallMs",
  });
  return db;
}

let shared: WindowcallDb | undefined;

/**
 * The signed-in account's device database (see device-user.ts), opened on first call (never
 * at import, so server rendering is safe) and again after the account in use changes.
 */
export function getWindowcallDb(): WindowcallDb {
  const name = currentDbName();
  if (shared?.name !== name) shared = createWindowcallDb(name);
  return shared;
}

/** Close the shared database (at sign-out); the next getWindowcallDb() opens the one then in use. */
export function releaseWindowcallDb(): void {
  shared?.close();
  shared = undefined;
}

/** Read a typed meta value. */
export async function getMeta<K extends MetaKey>(db: WindowcallDb, key: K): Promise<MetaValues[K] | undefined> {
  const row = await db.meta.get(key);
  return row?.value as MetaValues[K] | undefined;
}

/** Write a typed meta value. */
export async function setMeta<K extends MetaKey>(db: WindowcallDb, key: K, value: MetaValues[K]): Promise<void> {
  await db.meta.put({ key, value });
}
