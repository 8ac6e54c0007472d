import "server-only";
import { and, desc, eq, gt, isNull, ne, sql } from "drizzle-orm";
import { holdsVerifiedAddress } from "../users";
import type { Database } from "../../index";
import { coachGrants, coachInvites, users } from "../../schema";
import type { PilotGrantRow } from "@/lib/coach/types";
import { CODE_TTL_MS, EMAIL_OFFER_TTL_MS, hashCoachCode, newCoachCode } from "@/lib/coach/code";


/**
 * Who can see the pilot's season (Settings): coaches holding an unrevoked grant, and offers not
 * yet taken up. An e-mail offer stays an offer until that coach opens the Coach desk, whether or
 * not the address has an account, so this list never tells the pilot which addresses exist.
 */
export async function listPilotGrants(db: Database, pilotId: string, now = new Date()): Promise<PilotGrantRow[]> {
  const [grants, offers] = await Promise.all([
    db.select({ id: coachGrants.id, coachName: users.name, coachEmail: users.email, createdAt: coachGrants.createdAt })
      .from(coachGrants).innerJoin(users, eq(users.id, coachGrants.coachId))
      .where(and(eq(coachGrants.pilotId, pilotId), isNull(coachGrants.revokedAt)))
      .orderBy(desc(coachGrants.createdAt)),
    db.select().from(coachInvites)
      .where(and(eq(coachInvites.pilotId, pilotId), isNull(coachInvites.revokedAt), isNull(coachInvites.acceptedAt), gt(coachInvites.expiresAt, now)))
      .orderBy(desc(coachInvites.createdAt)),
  ]);
  return [
    ...grants.map((g) => ({ id: g.id, kind: "grant" as const, coachName: g.coachName, coachEmail: g.coachEmail, createdAt: g.createdAt.toISOString() })),
    ...offers.map((o) => o.email
      ? { id: o.id, kind: "email" as const, email: o.email, createdAt: o.createdAt.toISOString(), expiresAt: o.expiresAt!.toISOString() }
      : { id: o.id, kind: "code" as const, createdAt: o.createdAt.toISOString(), expiresAt: o.expiresAt!.toISOString() }),
  ];
}

/** Offers the pilot's season to an e-mail address; the same reply whatever the address is. */
export async function offerByEmail(db: Database, pilotId: string, email: string, now = new Date()) {
  const [row] = await db.insert(coachInvites)
    .values({ pilotId, email, expiresAt: new Date(now.getTime() + EMAIL_OFFER_TTL_MS) })
    .returning({ id: coachInvites.id, expiresAt: coachInvites.expiresAt });
  return { id: row!.id, kind: "email" as const, email, expiresAt: row!.expiresAt!.toISOString() };
}

/** A one-time code for the coach to type in; only its hash is kept. */
export async function offerByCode(db: Database, pilotId: string, now = new Date()) {
  const code = newCoachCode();
  const [row] = await db.insert(coachInvites)
    .values({ pilotId, codeHash: hashCoachCode(code), expiresAt: new Date(now.getTime() + CODE_TTL_MS) })
    .returning({ id: coachInvites.id, expiresAt: coachInvites.expiresAt });
  return { id: row!.id, kind: "code" as const, code, expiresAt: row!.expiresAt!.toISOString() };
}

/** Revokes the pilot's grant or open offer with this id at once; false if the pilot has none such. */
export async function revokeGrant(db: Database, pilotId: string, id: string): Promise<boolean> {
  const grant = await db.update(coachGrants).set({ revokedAt: sql`now()` })
    .where(and(eq(coachGrants.id, id), eq(coachGrants.pilotId, pilotId), isNull(coachGrants.revokedAt)))
    .returning({ id: coachGrants.id });
  if (grant.length) return true;
  const offer = await db.update(coachInvites).set({ revokedAt: sql`now()` })
    .where(and(eq(coachInvites.id, id), eq(coachInvites.pilotId, pilotId), isNull(coachInvites.revokedAt), isNull(coachInvites.acceptedAt)))
    .returning({ id: coachInvites.id });
  return offer.length > 0;
}

/** Turns a taken-up offer into a grant (one unrevoked grant per pilot and coach). */
async function grant(tx: Pick<Database, "insert" | "select">, pilotId: string, coachId: string) {
  const [held] = await tx.select({ id: coachGrants.id }).from(coachGrants)
    .where(and(eq(coachGrants.pilotId, pilotId), eq(coachGrants.coachId, coachId), isNull(coachGrants.revokedAt)));
  if (!held) await tx.insert(coachGrants).values({ pilotId, coachId });
}

/** Takes up every open e-mail offer to the coach's address (the Coach desk calls this); how many. */
export async function acceptEmailOffers(db: Database, coach: { id: string; email: string }, now = new Date()): Promise<number> {
  return db.transaction(async (tx) => {
    const offers = await tx.update(coachInvites).set({ acceptedAt: now })
      .where(and(eq(coachInvites.email, coach.email.toLowerCase()), holdsVerifiedAddress(coach.id, coachInvites.email), ne(coachInvites.pilotId, coach.id),
        isNull(coachInvites.revokedAt), isNull(coachInvites.acceptedAt), gt(coachInvites.expiresAt, now)))
      .returning({ pilotId: coachInvites.pilotId });
    for (const o of offers) await grant(tx, o.pilotId, coach.id);
    return offers.length;
  });
}

/** Takes up a one-time code; the granting pilot's id, or null for a code that is unknown, used, revoked, expired or the coach's own. */
export async function claimCode(db: Database, coachId: string, code: string, now = new Date()): Promise<string | null> {
  return db.transaction(async (tx) => {
    const [offer] = await tx.update(coachInvites).set({ acceptedAt: now })
      .where(and(eq(coachInvites.codeHash, hashCoachCode(code)), ne(coachInvites.pilotId, coachId),
        isNull(coachInvites.revokedAt), isNull(coachInvites.acceptedAt), gt(coachInvites.expiresAt, now)))
      .returning({ pilotId: coachInvites.pilotId });
    if (!offer) return null;
    await grant(tx, offer.pilotId, coachId);
    return offer.pilotId;
  });
}

/** Whether the coach holds the pilot's unrevoked grant. */
export async function holdsGrant(db: Database, coachId: string, pilotId: string): Promise<boolean> {
  const [row] = await db.select({ id: coachGrants.id }).from(coachGrants)
    .where(and(eq(coachGrants.coachId, coachId), eq(coachGrants.pilotId, pilotId), isNull(coachGrants.revokedAt))).limit(1);
  return !!row;
}

/** Whether the user coaches anyone (an unrevoked grant, or an open e-mail offer to their address): Home then links the Coach desk. */
export async function coachesAnyone(db: Database, user: { id: string; email: string }, now = new Date()): Promise<boolean> {
  const [grant] = await db.select({ id: coachGrants.id }).from(coachGrants)
    .where(and(eq(coachGrants.coachId, user.id), isNull(coachGrants.revokedAt))).limit(1);
  if (grant) return true;
  const [offer] = await db.select({ id: coachInvites.id }).from(coachInvites)
    .where(and(eq(coachInvites.email, user.email.toLowerCase()), holdsVerifiedAddress(user.id, coachInvites.email), isNull(coachInvites.revokedAt), isNull(coachInvites.acceptedAt), gt(coachInvites.expiresAt, now))).limit(1);
  return !!offer;
}
