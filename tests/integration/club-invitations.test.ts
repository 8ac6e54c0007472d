import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import { invitations, memberships } from "@/db/schema";
import { POST as createClubRoute } from "@/app/api/clubs/route";
import { POST as inviteRoute } from "@/app/api/clubs/[slug]/invitations/route";
import { POST as acceptRoute } from "@/app/api/invitations/accept/route";
import { hashEmailToken } from "@/lib/auth/email-tokens";
import { drainMailQueue } from "@/lib/mail/server/drain";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { linkIn, waitForMail } from "./support/mailbox";

/** Issue #14: an officer's invitation by e-mail, through the real local SMTP server, joins the right club with the right role, once. */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

const json = (body: unknown) => new Request("http://test/api", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
const reply = async (res: Response) => ({ status: res.status, body: await res.json() });
const slugOf = (slug: string) => ({ params: Promise.resolve({ slug }) });

async function clubOf(officer: MockSessionUser, name: string): Promise<string> {
  actAs(officer);
  const res = await reply(await createClubRoute(json({ name })));
  expect(res.status).toBe(201);
  return res.body.club.slug as string;
}

/** The officer invites `email` as `role`; returns the link's token from the mail the SMTP server received. */
async function invite(officer: MockSessionUser, slug: string, email: string, role: string): Promise<string> {
  actAs(officer);
  expect((await inviteRoute(json({ email, role }), slugOf(slug))).status).toBe(202);
  await drainMailQueue();
  const [mail] = await waitForMail(email);
  expect(mail!.subject).toMatch(/^Join .* — Windowcall$/);
  return linkIn(mail!, "/join-club").token;
}

const roleIn = async (slug: string, userId: string) => {
  // the club by its address name: the invitation must land in this club, not another
  const rows = await db.execute<{ role: string }>(
    sql`select m.role from memberships m join clubs c on c.id = m.club_id where c.slug = ${slug} and m.user_id = ${userId}`,
  );
  return rows.rows[0]?.role ?? null;
};

describe("club invitations by e-mail", () => {
  it("the link joins the club it was sent for, with the invited role; a second use fails with a message", async () => {
    const officer = await freshUser("inv-officer");
    const slug = await clubOf(officer, "Test Invitation Club");
    const other = await clubOf(await freshUser("inv-other-officer"), "Test Other Club");
    const invitee = await freshUser("inv-coach");
    const token = await invite(officer, slug, invitee.email, "coach");

    actAs(invitee);
    const first = await reply(await acceptRoute(json({ token })));
    expect(first).toEqual({ status: 200, body: { joined: { slug, clubName: "Test Invitation Club", role: "coach" } } });
    expect(await roleIn(slug, invitee.id)).toBe("coach");
    expect(await roleIn(other, invitee.id)).toBeNull();

    const someoneElse = await freshUser("inv-late");
    actAs(someoneElse);
    const again = await reply(await acceptRoute(json({ token })));
    expect(again.status).toBe(410);
    expect(again.body.error.message).toMatch(/already used/);
    expect(await roleIn(slug, someoneElse.id)).toBeNull();
  });

  it("an expired link fails with a message and joins nobody", async () => {
    const officer = await freshUser("exp-officer");
    const slug = await clubOf(officer, "Test Expiry Club");
    const invitee = await freshUser("exp-member");
    const token = await invite(officer, slug, invitee.email, "member");
    const [stored] = await db.select().from(invitations).where(eq(invitations.tokenHash, hashEmailToken(token)));
    expect(Math.abs(stored!.expiresAt.getTime() - stored!.createdAt.getTime() - 7 * 86_400_000)).toBeLessThan(60_000); // the app's clock and the database's
    expect(JSON.stringify(stored)).not.toContain(token); // only the hash is kept
    await db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.id, stored!.id));

    actAs(invitee);
    const res = await reply(await acceptRoute(json({ token })));
    expect(res.status).toBe(410);
    expect(res.body.error.message).toMatch(/expired/);
    expect(await roleIn(slug, invitee.id)).toBeNull();
  });

  it("a newer invitation to the same address retires the older link; an unknown token is 404", async () => {
    const officer = await freshUser("re-officer");
    const slug = await clubOf(officer, "Test Reinvite Club");
    const invitee = await freshUser("re-member");
    const older = await invite(officer, slug, invitee.email, "member");
    actAs(officer);
    expect((await inviteRoute(json({ email: invitee.email, role: "officer" }), slugOf(slug))).status).toBe(202);
    await drainMailQueue();
    const newer = linkIn((await waitForMail(invitee.email, 2))[0]!, "/join-club").token;
    expect(newer).not.toBe(older);

    actAs(invitee);
    expect((await acceptRoute(json({ token: older }))).status).toBe(404);
    expect((await acceptRoute(json({ token: "x".repeat(43) }))).status).toBe(404);
    expect((await acceptRoute(json({ token: newer }))).status).toBe(200);
    expect(await roleIn(slug, invitee.id)).toBe("officer");
  });

  it("signed out is 401 and spends nothing; a member cannot be invited again; only officers invite", async () => {
    const officer = await freshUser("gate-officer");
    const slug = await clubOf(officer, "Test Gate Club");
    const invitee = await freshUser("gate-member");
    const token = await invite(officer, slug, invitee.email, "member");
    actAs(null);
    expect((await acceptRoute(json({ token }))).status).toBe(401);
    actAs(invitee);
    expect((await acceptRoute(json({ token }))).status).toBe(200);

    actAs(officer);
    const dup = await reply(await inviteRoute(json({ email: invitee.email, role: "coach" }), slugOf(slug)));
    expect(dup.status).toBe(409);
    expect(dup.body.error.message).toMatch(/already a member/);
    actAs(invitee);
    expect((await inviteRoute(json({ email: "someone@example.com", role: "member" }), slugOf(slug))).status).toBe(403);
    actAs(await freshUser("gate-stranger"));
    expect((await inviteRoute(json({ email: "someone@example.com", role: "member" }), slugOf(slug))).status).toBe(404);
    expect(await db.select().from(memberships).where(and(eq(memberships.userId, invitee.id)))).toHaveLength(1);
  });
});
