import "./support/session";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as closeRoute } from "@/app/api/clubs/[slug]/days/[date]/close/route";
import { PUT as summariesRoute } from "@/app/api/clubs/[slug]/day-summaries/route";
import { openClubDay } from "@/db/queries/club-days";
import { clubFields, clubs, memberships } from "@/db/schema";
import { drainMailQueue } from "@/lib/mail/server/drain";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { addPhone, dayRun, measure } from "./support/day-records";
import { mailTo, waitForMail } from "./support/mailbox";

/**
 * Issue #14: the day summary e-mail, through the real queue and the local SMTP fake. Only members
 * who turned it on get it, once, when an officer closes the day; it ends with an unsubscribe line
 * (the club page, where the setting is). The day: one run of Pia's at Reed Bank, 5→60, 62.4→130,
 * 135→180 s in "best three of a minute" = 160.0 s, longest flight 67.6 s, turnaround 3.7 s (median of 2.4 and 5.0).
 */
const DAY = "2026-07-04";
let slug = "";
let officer: MockSessionUser, optedIn: MockSessionUser, optedOut: MockSessionUser, leftOn: MockSessionUser;

const json = (method: string, body?: unknown) =>
  new Request("http://test/api", { method, headers: { "content-type": "application/json" }, ...(body === undefined ? {} : { body: JSON.stringify(body) }) });
const close = (as: MockSessionUser) => {
  actAs(as);
  return closeRoute(json("POST"), { params: Promise.resolve({ slug, date: DAY }) });
};
const setSummaries = (as: MockSessionUser, on: boolean) => {
  actAs(as);
  return summariesRoute(json("PUT", { on }), { params: Promise.resolve({ slug }) });
};

beforeAll(async () => {
  [officer, optedIn, optedOut, leftOn] = (await Promise.all(["sum-officer", "sum-in", "sum-out", "sum-left"].map((l) => freshUser(l)))) as MockSessionUser[] as [MockSessionUser, MockSessionUser, MockSessionUser, MockSessionUser];
  slug = `summary-club-${Date.now()}`;
  const [club] = await db.insert(clubs).values({ name: "Reed Bank Flyers", slug }).returning();
  await db.insert(memberships).values([
    { clubId: club!.id, userId: officer.id, role: "officer" },
    { clubId: club!.id, userId: optedIn.id, role: "member" },
    { clubId: club!.id, userId: optedOut.id, role: "member" },
    { clubId: club!.id, userId: leftOn.id, role: "member" },
  ]);
  const [field] = await db.insert(clubFields).values({ clubId: club!.id, name: "Reed Bank" }).returning();
  await openClubDay(db, { clubId: club!.id, fieldId: field!.id, day: DAY, userId: officer.id });
  const phone = await addPhone(optedIn.id, 0, 40, "sum");
  await measure(phone, Date.parse(`${DAY}T10:00:00Z`) - 60_000);
  await dayRun({ creatorId: optedIn.id, field: "Reed Bank", at: `${DAY}T10:00:00Z`, pilots: [optedIn.id], records: [{ phone, signals: true, lanes: { 0: [[5, 60], [62.4, 130], [135, 180]] } }] });
});

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

describe("day summary e-mail", () => {
  it("is off until a member turns it on; turning it off again stops it", async () => {
    expect((await setSummaries(optedIn, true)).status).toBe(200);
    expect((await setSummaries(optedOut, true)).status).toBe(200);
    expect((await setSummaries(optedOut, false)).status).toBe(200);
    // leftOn never touches it: off by default
  });

  it("a member cannot close the day (403); the officer's close queues one summary per opted-in member, once", async () => {
    expect((await close(optedIn)).status).toBe(403);
    const first = await close(officer);
    expect(first.status).toBe(200);
    expect(((await first.json()) as { summaries: number }).summaries).toBe(1);
    const again = await close(officer);
    expect(((await again.json()) as { summaries: number }).summaries).toBe(0);
    await drainMailQueue();

    const [mail, ...more] = await waitForMail(optedIn.email);
    expect(more).toEqual([]);
    expect(mail!.subject).toBe("Reed Bank Flyers: the field day of Sat 4 Jul 2026 — Windowcall");
    expect(mail!.text).toContain("1 window flown by 1 pilot.");
    expect(mail!.text).toContain(`Best in custom task: ${optedIn.name}, 160.0 s.`);
    expect(mail!.text).toContain(`Longest flight: ${optedIn.name}, 67.6 s.`);
    expect(mail!.text).toContain(`Quickest turnaround (median): ${optedIn.name}, 3.7 s.`);
    expect(mail!.text).toContain(`/clubs/${slug}/days/${DAY}`);
    expect(mail!.text).toMatch(new RegExp(`To stop these e-mails, open \\S+/clubs/${slug}#day-summaries`));
    expect(mail!.html).toContain(">Unsubscribe</a>");
    expect(await mailTo(optedOut.email)).toEqual([]);
    expect(await mailTo(leftOn.email)).toEqual([]);
    expect(await mailTo(officer.email)).toEqual([]);
  });
});
