import { and, asc, desc, eq, gte, sql } from "drizzle-orm";
import type { Database } from "../index";
import { coachNotes, practicePlans, runs, users } from "../schema";
import type { PlanItem } from "@/lib/coach/plan-goals";
import { syncStamp } from "../queries/sync-db";

/** An invented practice plan from the demo coach (Mara) to Ada. */
const ADA_PLAN: { title: string; items: PlanItem[] } = {
  title: "Quicker relaunches before the spring contest",
  items: [
    { letter: "H", variant: 600, goal: "three 1-2-3-4 windows, median turnaround under 3 s", windows: 3, measure: { kind: "median-turnaround-below", seconds: 3 } },
    { letter: "A", variant: 600, goal: "two last-flight windows, median result at least 80 % of the maximum", windows: 2, measure: { kind: "median-share-at-least", percent: 80 } },
    { letter: "F", variant: 600, goal: "one 3-out-of-6 window, calm and clean launches", windows: 1, measure: null },
  ],
};

/**
 * The coach desk demo (invented words): Mara's note on Ada's latest own run with Ada's answer, and
 * a practice plan Mara assigned to Ada; Ada's task H windows flown after the plan was assigned
 * (two at most) are linked to its first item, so the plan shows progress. Does nothing when Mara
 * has written to Ada already.
 */
export async function seedCoaching(db: Database): Promise<void> {
  const [mara] = await db.select().from(users).where(eq(users.email, "mara@example.com"));
  const [ada] = await db.select().from(users).where(eq(users.email, "ada@example.com"));
  if (!mara || !ada) return;
  const [has] = await db.select({ n: sql<number>`count(*)::int` }).from(coachNotes).where(and(eq(coachNotes.coachId, mara.id), eq(coachNotes.pilotId, ada.id)));
  if ((has?.n ?? 0) > 0) return;
  const [latest] = await db.select({ id: runs.id, sessionId: runs.sessionId, createdAt: runs.createdAt }).from(runs)
    .where(eq(runs.createdBy, ada.id)).orderBy(desc(runs.createdAt)).limit(1);
  if (!latest) return;
  const at = latest.createdAt.getTime();
  await db.transaction(async (tx) => {
    const [note] = await tx.insert(coachNotes).values({
      sessionId: latest.sessionId, runId: latest.id, pilotId: ada.id, coachId: mara.id, authorId: mara.id,
      body: "Good window. Your relaunch after the two-minute flight took longest: land facing the launch spot and keep the throw hand free.",
      createdAt: new Date(at + 3 * 3600_000),
    }).returning();
    await tx.insert(coachNotes).values({
      sessionId: latest.sessionId, runId: latest.id, pilotId: ada.id, coachId: mara.id, authorId: ada.id, replyTo: note!.id,
      body: "Thanks. The wind swung round then; I'll practise catching on the move next session.",
      createdAt: new Date(at + 5 * 3600_000),
    });
    const assignedAt = new Date(at - 28 * 24 * 3600_000);
    const [plan] = await tx.insert(practicePlans).values({ pilotId: ada.id, coachId: mara.id, title: ADA_PLAN.title, items: ADA_PLAN.items, createdAt: assignedAt }).returning();
    const flown = await tx.select({ id: runs.id }).from(runs)
      .where(and(eq(runs.createdBy, ada.id), eq(runs.taskCode, "H"), gte(runs.createdAt, assignedAt), sql`${runs.task} ->> 'workingTimeSec' = '600'`))
      .orderBy(asc(runs.createdAt)).limit(2);
    for (const r of flown) await tx.update(runs).set({ planId: plan!.id, planItem: 0, ...syncStamp() }).where(eq(runs.id, r.id));
  });
}
