import "server-only";
import { and, asc, eq, getTableColumns, inArray, or, sql } from "drizzle-orm";
import type { Database } from "../index";
import {
  clubDayDecisions, clubDayRuns, clubDays, clubFields, clubs, coachGrants, coachInvites, coachNotes, devices, events, fieldSessions, laneConsents, memberships,
  practicePlans, runLanes, runs, users,
} from "../schema";
import { alias } from "drizzle-orm/pg-core";
import { exportHangar } from "./hangar-export";

// the lanes as stored, without the season's numbers PostgreSQL generates from their derivation
const allLaneColumns = getTableColumns(runLanes);
type LaneColumns = typeof allLaneColumns;
const laneColumns = Object.fromEntries(Object.entries(allLaneColumns).filter(([key]) => !key.startsWith("season"))) as {
  [K in keyof LaneColumns as K extends `season${string}` ? never : K]: LaneColumns[K];
};

// the runs as stored, without the flag PostgreSQL generates from their task
const allRunColumns = getTableColumns(runs);
const runColumns = Object.fromEntries(Object.entries(allRunColumns).filter(([key]) => key !== "flightsOnSignal")) as Omit<
  typeof allRunColumns, "flightsOnSignal"
>;

/** The format of "export all my data"; bump when its shape changes. */
export const ACCOUNT_EXPORT_FORMAT = "windowcall-account-export/1";

/**
 * Everything Windowcall holds about one account, for "export all my data" (never a password
 * hash): the account; club memberships (with whether it asked for the day summaries); the runs it
 * put in club field days and the decisions it recorded as an officer on lanes recorded differently; coach grants it gave and received, and the offers of its
 * season it made (by address or by code; never the code); devices; practice plans assigned to it
 * and those it assigned as a coach; coach notes about its runs and sessions and those it wrote; field sessions it owns; runs in those sessions, runs it created and runs where it flies
 * a lane, each with all lanes and their results; the events it recorded or that belong to its
 * lanes (a run-wide event such as the window start belongs to every lane); and its decisions on
 * lanes someone else recorded for it (accepted, disputed with the reason, hidden; when).
 */
export async function exportAccount(db: Database, userId: string) {
  const [account] = await db
    .select({ id: users.id, email: users.email, name: users.name, role: users.role, createdAt: users.createdAt })
    .from(users)
    .where(eq(users.id, userId));
  if (!account) return undefined;
  const myRun = sql`(${runs.createdBy} = ${userId}
    or ${runs.sessionId} in (select id from field_sessions where owner_id = ${userId})
    or exists (select 1 from run_lanes l where l.run_id = ${runs.id} and l.pilot_user_id = ${userId}))`;
  const author = alias(users, "author");
  const [clubRoles, dayChoices, dayDecisions, grantsGiven, grantsReceived, myDevices, plans, sessions, runRows, consents, offers, notes, plansAssigned] = await Promise.all([
    db.select({ clubId: clubs.id, club: clubs.name, role: memberships.role, since: memberships.createdAt, daySummaries: memberships.daySummaries })
      .from(memberships).innerJoin(clubs, eq(clubs.id, memberships.clubId)).where(eq(memberships.userId, userId)),
    db.select({ runId: clubDayRuns.runId, dayId: clubDays.id, club: clubs.name, field: clubFields.name, day: clubDays.day, chosenAt: clubDayRuns.createdAt })
      .from(clubDayRuns).innerJoin(clubDays, eq(clubDays.id, clubDayRuns.dayId)).innerJoin(clubs, eq(clubs.id, clubDays.clubId))
      .innerJoin(clubFields, eq(clubFields.id, clubDays.fieldId))
      .where(eq(clubDayRuns.chosenBy, userId)).orderBy(asc(clubDayRuns.createdAt)),
    db.select({ club: clubs.name, day: clubDayDecisions.day, runId: clubDayDecisions.runId, lane: clubDayDecisions.lane, deviceId: clubDayDecisions.deviceId,
      note: clubDayDecisions.note, decidedAt: clubDayDecisions.decidedAt })
      .from(clubDayDecisions).innerJoin(clubs, eq(clubs.id, clubDayDecisions.clubId))
      .where(eq(clubDayDecisions.decidedBy, userId)).orderBy(asc(clubDayDecisions.decidedAt)),
    db.select({ coachId: coachGrants.coachId, coach: users.name, createdAt: coachGrants.createdAt, revokedAt: coachGrants.revokedAt })
      .from(coachGrants).innerJoin(users, eq(users.id, coachGrants.coachId)).where(eq(coachGrants.pilotId, userId)),
    db.select({ pilotId: coachGrants.pilotId, pilot: users.name, createdAt: coachGrants.createdAt, revokedAt: coachGrants.revokedAt })
      .from(coachGrants).innerJoin(users, eq(users.id, coachGrants.pilotId)).where(eq(coachGrants.coachId, userId)),
    db.select({ id: devices.id, label: devices.label, createdAt: devices.createdAt, lastSeenAt: devices.lastSeenAt })
      .from(devices).where(eq(devices.userId, userId)),
    db.select({ id: practicePlans.id, coachId: practicePlans.coachId, title: practicePlans.title, items: practicePlans.items, createdAt: practicePlans.createdAt })
      .from(practicePlans).where(eq(practicePlans.pilotId, userId)).orderBy(asc(practicePlans.createdAt)),
    db.select().from(fieldSessions).where(eq(fieldSessions.ownerId, userId)).orderBy(asc(fieldSessions.startedAt)),
    db.select(runColumns).from(runs).where(myRun).orderBy(asc(runs.createdAt)),
    db.select({ runId: laneConsents.runId, lane: laneConsents.lane, decision: laneConsents.status, reason: laneConsents.reason, decidedAt: laneConsents.decidedAt })
      .from(laneConsents).where(eq(laneConsents.pilotUserId, userId)).orderBy(asc(laneConsents.decidedAt)),
    // offers of the season the user made (the address offered; never a code's hash)
    db.select({ id: coachInvites.id, email: coachInvites.email, byCode: sql<boolean>`${coachInvites.codeHash} is not null`, createdAt: coachInvites.createdAt,
      expiresAt: coachInvites.expiresAt, acceptedAt: coachInvites.acceptedAt, revokedAt: coachInvites.revokedAt })
      .from(coachInvites).where(eq(coachInvites.pilotId, userId)).orderBy(asc(coachInvites.createdAt)),
    // notes about the user's runs and sessions, and notes and answers the user wrote as a coach or pilot
    db.select({ id: coachNotes.id, pilotId: coachNotes.pilotId, coachId: coachNotes.coachId, author: author.name, authorId: coachNotes.authorId,
      sessionId: coachNotes.sessionId, runId: coachNotes.runId, replyTo: coachNotes.replyTo, body: coachNotes.body, createdAt: coachNotes.createdAt })
      .from(coachNotes).innerJoin(author, eq(author.id, coachNotes.authorId))
      .where(or(eq(coachNotes.pilotId, userId), eq(coachNotes.authorId, userId))).orderBy(asc(coachNotes.createdAt), asc(coachNotes.id)),
    db.select({ id: practicePlans.id, pilotId: practicePlans.pilotId, title: practicePlans.title, items: practicePlans.items, createdAt: practicePlans.createdAt })
      .from(practicePlans).where(eq(practicePlans.coachId, userId)).orderBy(asc(practicePlans.createdAt)),
  ]);
  const runIds = runRows.map((r) => r.id);
  const [lanes, eventRows] = runIds.length
    ? await Promise.all([
        db.select(laneColumns).from(runLanes).where(inArray(runLanes.runId, runIds)).orderBy(asc(runLanes.lane)),
        db.select().from(events).where(and(inArray(events.runId, runIds), or(eq(events.recordedBy, userId), sql`exists (
            select 1 from run_lanes l where l.run_id = ${events.runId} and l.pilot_user_id = ${userId}
            and (${events.body}->>'lane' is null or (${events.body}->>'lane')::int = l.lane))`)))
          .orderBy(asc(events.correctedMs)),
      ])
    : [[], []];
  return {
    format: ACCOUNT_EXPORT_FORMAT,
    exportedAt: new Date().toISOString(),
    account,
    memberships: clubRoles,
    clubDayChoices: dayChoices,
    clubDayDecisions: dayDecisions,
    coachGrants: { given: grantsGiven, received: grantsReceived },
    devices: myDevices,
    practicePlans: plans,
    practicePlansAssigned: plansAssigned,
    coachOffers: offers,
    coachNotes: notes,
    sessions,
    runs: runRows.map((r) => ({ ...r, lanes: lanes.filter((l) => l.runId === r.id) })),
    events: eventRows,
    consentDecisions: consents,
    hangar: await exportHangar(db, userId),
  };
}

export type AccountExport = NonNullable<Awaited<ReturnType<typeof exportAccount>>>;
