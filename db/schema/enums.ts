import { pgEnum } from "drizzle-orm/pg-core";

/** Site-wide role: admins administer the site, everyone else is a member. */
export const globalRoleEnum = pgEnum("global_role", ["member", "admin"]);

/** Role inside one club. */
export const clubRoleEnum = pgEnum("club_role", ["member", "coach", "officer"]);

/** What the server decided about a pushed item. */
export const ackStatusEnum = pgEnum("ack_status", ["applied", "duplicate", "rejected"]);

export const contestStatusEnum = pgEnum("contest_status", ["draft", "open", "running", "finished"]);

export const paymentStatusEnum = pgEnum("payment_status", ["pending", "paid", "failed", "refunded"]);

/** A pilot's decision on a lane someone else recorded for them (lib/sync/consent.ts); no row = pending. */
export const laneConsentStatusEnum = pgEnum("lane_consent_status", ["accepted", "disputed", "hidden"]);
