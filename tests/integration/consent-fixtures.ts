import { v7 as uuidv7 } from "uuid";
import { clubs, coachGrants, memberships, users } from "@/db/schema";
import { POST as consentRoute } from "@/app/api/runs/[runId]/lanes/[lane]/consent/route";
import { listChanges } from "@/db/queries/sync-pull";
import type { PullItem } from "@/lib/validations/sync";
import { db } from "./support/db";

type TestUser = { id: string; email: string; name: string; role: "member" | "admin" };

/** A fresh club of fresh accounts (so other files' counts and coach scopes are untouched). */
export async function freshClub(names: readonly string[]): Promise<TestUser[]> {
  const tag = uuidv7();
  const [club] = await db.insert(clubs).values({ name: `Consent club ${tag}`, slug: `consent-${tag}` }).returning();
  const out: TestUser[] = [];
  for (const name of names) {
    const [u] = await db.insert(users).values({ email: `${name.toLowerCase()}-${tag}@example.com`, name }).returning();
    await db.insert(memberships).values({ clubId: club!.id, userId: u!.id });
    out.push({ id: u!.id, email: u!.email, name: u!.name, role: "member" });
  }
  return out;
}

/** `coach` may read `pilot`'s record. */
export async function grant(pilot: TestUser, coach: TestUser): Promise<void> {
  await db.insert(coachGrants).values({ pilotId: pilot.id, coachId: coach.id });
}

/** POST /api/runs/[runId]/lanes/[lane]/consent as the current test session. */
export async function decide(runId: string, lane: number | string, body: unknown) {
  const req = new Request(`http://test/api/runs/${runId}/lanes/${lane}/consent`, {
    method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" },
  });
  const res = await consentRoute(req, { params: Promise.resolve({ runId, lane: String(lane) }) });
  return { status: res.status, body: await res.json() };
}

/** Every item the user pulls from 0, newest copy of each record last. */
export async function pullEverything(userId: string): Promise<PullItem[]> {
  const out: PullItem[] = [];
  let cursor = "0";
  for (let hasMore = true; hasMore; ) {
    const page = await listChanges(db, { userId, cursor, limit: 2000 });
    out.push(...page.items);
    ({ nextCursor: cursor, hasMore } = page);
  }
  return out;
}

/** The last pulled copy of a run. */
export function runItem(items: PullItem[], runId: string) {
  return items.filter((i): i is Extract<PullItem, { type: "run" }> => i.type === "run" && i.data.id === runId).at(-1);
}
