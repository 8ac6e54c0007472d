import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { invitations } from "@/db/schema";
import { POST as createClubRoute } from "@/app/api/clubs/route";
import { POST as inviteRoute } from "@/app/api/clubs/[slug]/invitations/route";
import { DELETE as withdrawRoute } from "@/app/api/clubs/[slug]/invitations/[invitationId]/route";
import { POST as acceptRoute } from "@/app/api/invitations/accept/route";
import { hashEmailToken } from "@/lib/auth/email-tokens";
import { drainMailQueue } from "@/lib/mail/server/drain";
import { memberships } from "@/db/schema";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { linkIn, waitForMail } from "./support/mailbox";

/** Issue #14: an officer withdraws an invitation not yet used; its link stops working. Nobody else can, and a used one stays. */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

const json = (body: unknown) => new Request("http://test/api", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
const reply = async (res: Response) => ({ status: res.status, body: await res.json() });

async function invited(officer: MockSessionUser, slug: string, email: string) {
  actAs(officer);
  expect((await inviteRoute(json({ email, role: "member" }), { params: Promise.resolve({ slug }) })).status).toBe(202);
  await drainMailQueue();
  const token = linkIn((await waitForMail(email))[0]!, "/join-club").token;
  const [row] = await db.select({ id: invitations.id, clubId: invitations.clubId }).from(invitations).where(eq(invitations.tokenHash, hashEmailToken(token)));
  return { token, id: row!.id, clubId: row!.clubId };
}
const withdraw = async (as: MockSessionUser | null, slug: string, invitationId: string) => {
  actAs(as);
  return (await withdrawRoute(new Request("http://test/api", { method: "DELETE" }), { params: Promise.resolve({ slug, invitationId }) })).status;
};
const exists = async (id: string) => (await db.select({ id: invitations.id }).from(invitations).where(eq(invitations.id, id))).length === 1;

describe("DELETE /api/clubs/[slug]/invitations/[invitationId]", () => {
  it("the officer withdraws it: its link then answers 'not valid' and joins nobody", async () => {
    const officer = await freshUser("wd-officer");
    actAs(officer);
    const slug = (await reply(await createClubRoute(json({ name: "Withdraw Club" })))).body.club.slug as string;
    const invitee = await freshUser("wd-invitee");
    const inv = await invited(officer, slug, invitee.email);

    const member = await freshUser("wd-member");
    await db.insert(memberships).values({ clubId: inv.clubId, userId: member.id, role: "member" });
    const stranger = await freshUser("wd-stranger");
    expect(await withdraw(null, slug, inv.id)).toBe(401);
    expect(await withdraw(member, slug, inv.id)).toBe(403);
    expect(await withdraw(stranger, slug, inv.id)).toBe(404);
    expect(await exists(inv.id)).toBe(true);

    expect(await withdraw(officer, slug, inv.id)).toBe(200);
    expect(await exists(inv.id)).toBe(false);
    expect(await withdraw(officer, slug, inv.id)).toBe(404);
    actAs(invitee);
    const use = await reply(await acceptRoute(json({ token: inv.token })));
    expect(use.status).toBe(404);
    expect(use.body.error.message).toMatch(/not valid/);
  });

  it("another club's officer cannot withdraw it through their own club, and a used invitation stays", async () => {
    const officer = await freshUser("wd2-officer");
    actAs(officer);
    const slug = (await reply(await createClubRoute(json({ name: "Withdraw Club Two" })))).body.club.slug as string;
    const otherOfficer = await freshUser("wd2-other");
    actAs(otherOfficer);
    const otherSlug = (await reply(await createClubRoute(json({ name: "Withdraw Club Three" })))).body.club.slug as string;
    const invitee = await freshUser("wd2-invitee");
    const inv = await invited(officer, slug, invitee.email);
    expect(await withdraw(otherOfficer, otherSlug, inv.id)).toBe(404);
    expect(await exists(inv.id)).toBe(true);

    actAs(invitee);
    expect((await acceptRoute(json({ token: inv.token }))).status).toBe(200);
    expect(await withdraw(officer, slug, inv.id)).toBe(404);
    expect(await exists(inv.id)).toBe(true);
  });
});
