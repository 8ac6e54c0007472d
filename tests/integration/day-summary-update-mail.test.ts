import "./support/session";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as closeRoute } from "@/app/api/clubs/[slug]/days/[date]/close/route";
import { PUT as decideRoute } from "@/app/api/clubs/[slug]/days/[date]/decisions/route";
import { PUT as summariesRoute } from "@/app/api/clubs/[slug]/day-summaries/route";
import { openClubDay } from "@/db/queries/club-days";
import { clubFields, clubs, memberships } from "@/db/schema";
import { drainMailQueue } from "@/lib/mail/server/drain";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { addPhone, dayRun, measure, type Phone } from "./support/day-records";
import { mailTo, waitForMail } from "./support/mailbox";

/**
 * Issue #14: a decision made after the day was closed changes the board, so the members who asked for
 * the summary get it again, marked updated, saying what changed, once per decision (the real queue and
 * the local SMTP fake). The day: one run of Pia's at Alder Slope in "best three of a minute" (60 s cap),
 * on her phone 5→60, 62.4→130, 135→180 s = 55.0 + 60.0 + 45.0 = 160.0 s, turnarounds 2.4 and 5.0 s
 * (median 3.7); the officer's phone, a backup started late, missed the first flight: 60.0 + 45.0 = 105.0 s,
 * one turnaround of 5.0 s. The conflict rules use Pia's record (more flights); the officer may choose his.
 */
const DAY = "2026-07-18";
let slug = "";
let officer: MockSessionUser, pia: MockSessionUser, quiet: MockSessionUser;
let runId = "";
let officersPhone: Phone;

const json = (method: string, body?: unknown) =>
  new Request("http://test/api", { method, headers: { "content-type": "application/json" }, ...(body === undefined ? {} : { body: JSON.stringify(body) }) });
const decide = (body: unknown) => {
  actAs(officer);
  return decideRoute(json("PUT", body), { params: Promise.resolve({ slug, date: DAY }) });
};
const updates = async (to: string) =>
  (await db.execute<{ n: number }>(sql`select count(*)::int as n from mail_queue where "to" = ${to} and kind = 'day-summary-update'`)).rows[0]!.n;

beforeAll(async () => {
  [officer, pia, quiet] = (await Promise.all(["upd-officer", "upd-pia", "upd-quiet"].map((l) => freshUser(l)))) as [MockSessionUser, MockSessionUser, MockSessionUser];
  slug = `update-club-${Date.now()}`;
  const [club] = await db.insert(clubs).values({ name: "Alder Slope Soarers", slug }).returning();
  await db.insert(memberships).values([
    { clubId: club!.id, userId: officer.id, role: "officer" },
    { clubId: club!.id, userId: pia.id, role: "member" },
    { clubId: club!.id, userId: quiet.id, role: "member" },
  ]);
  const [field] = await db.insert(clubFields).values({ clubId: club!.id, name: "Alder Slope" }).returning();
  await openClubDay(db, { clubId: club!.id, fieldId: field!.id, day: DAY, userId: officer.id });
  const piasPhone = await addPhone(pia.id, 0, 40, "upd-pia");
  officersPhone = await addPhone(officer.id, 0, 40, "upd-officer");
  await measure(piasPhone, Date.parse(`${DAY}T10:00:00Z`) - 60_000);
  await measure(officersPhone, Date.parse(`${DAY}T10:00:00Z`) - 60_000);
  runId = await dayRun({
    creatorId: pia.id, field: "Alder Slope", at: `${DAY}T10:00:00Z`, pilots: [pia.id],
    records: [
      { phone: piasPhone, signals: true, lanes: { 0: [[5, 60], [62.4, 130], [135, 180]] } },
      { phone: officersPhone, lanes: { 0: [[62.4, 130], [135, 180]] } },
    ],
  });
  actAs(pia);
  expect((await summariesRoute(json("PUT", { on: true }), { params: Promise.resolve({ slug }) })).status).toBe(200);
});

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

describe("a decision after the close re-sends the day summary", () => {
  it("a decision while the day is open mails nobody (the summary is still to come)", async () => {
    expect((await decide({ runId, lane: 0, deviceId: null, note: "Checking with the pilot" })).status).toBe(200);
    expect(await updates(pia.email)).toBe(0);
    actAs(officer);
    expect((await closeRoute(json("POST"), { params: Promise.resolve({ slug, date: DAY }) })).status).toBe(200);
    await drainMailQueue();
    const [summary] = await waitForMail(pia.email);
    expect(summary!.text).toContain(`Best in custom task: ${pia.name}, 160.0 s.`);
  });

  it("choosing the officer's record after the close: one updated summary saying what changed, not again for the same decision", async () => {
    expect((await decide({ runId, lane: 0, deviceId: officersPhone.id, note: "Pia's first launch was a test throw" })).status).toBe(200);
    expect((await decide({ runId, lane: 0, deviceId: officersPhone.id, note: "Pia's first launch was a test throw" })).status).toBe(200); // a repeated PUT
    expect(await updates(pia.email)).toBe(1);
    await drainMailQueue();
    const [mail, first, ...more] = await waitForMail(pia.email, 2);
    expect(more).toEqual([]);
    expect(first!.subject).toBe("Alder Slope Soarers: the field day of Sat 18 Jul 2026 — Windowcall");
    expect(mail!.subject).toBe("Alder Slope Soarers: the field day of Sat 18 Jul 2026, updated — Windowcall");
    expect(mail!.text).toContain("An officer changed a result of the field day of Sat 18 Jul 2026 at Alder Slope Soarers after it was closed.");
    expect(mail!.text).toContain(`${pia.name}'s window at 10:00 UTC (custom task): the record of ${officer.name}'s phone counts now, 105.0 s (was 160.0 s).`);
    expect(mail!.text).toContain(`Best in custom task: ${pia.name}, 105.0 s.`);
    expect(mail!.text).toContain(`Longest flight: ${pia.name}, 67.6 s.`);
    expect(mail!.text).toContain(`Quickest turnaround (median): ${pia.name}, 5.0 s.`);
    expect(mail!.text).toMatch(new RegExp(`To stop these e-mails, open \\S+/clubs/${slug}#day-summaries`));
    expect(await mailTo(quiet.email)).toEqual([]);
    expect(await mailTo(officer.email)).toEqual([]);
  });

  it("a note changed alone mails nobody; taking the choice back mails again: the rules' pick counts", async () => {
    expect((await decide({ runId, lane: 0, deviceId: officersPhone.id, note: "Confirmed by the pilot" })).status).toBe(200);
    expect(await updates(pia.email)).toBe(1);
    expect((await decide({ runId, lane: 0, deviceId: null, note: "Back to the rules' record" })).status).toBe(200);
    expect(await updates(pia.email)).toBe(2);
    await drainMailQueue();
    const [mail] = await waitForMail(pia.email, 3);
    expect(mail!.text).toContain(`${pia.name}'s window at 10:00 UTC (custom task): the record the rules pick counts again, 160.0 s (was 105.0 s).`);
    expect(mail!.text).toContain(`Best in custom task: ${pia.name}, 160.0 s.`);
  });
});
