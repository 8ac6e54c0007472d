import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { emailTokens, users } from "@/db/schema";
import { POST as signUpRoute } from "@/app/api/account/sign-up/route";
import { POST as verifyRoute } from "@/app/api/account/verify-email/route";
import { POST as resendRoute } from "@/app/api/account/verification/route";
import { POST as forgotRoute } from "@/app/api/account/forgot-password/route";
import { POST as resetRoute } from "@/app/api/account/reset-password/route";
import { hashEmailToken } from "@/lib/auth/email-tokens";
import { drainMailQueue } from "@/lib/mail/server/drain";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import { freshAddress, makeAccount, withTrustProxy } from "./support/accounts";
import { attempt } from "./support/sign-in";
import { linkIn, mailTo, waitForMail } from "./support/mailbox";

/** Issue #14 (e-mail) and #9 (sign-up reveals no account), through the real local SMTP server. */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

const PASSWORD = "thermal-column-26";
/**
 * Calls a route handler as a request from its own address; then sends what it queued, as after() does
 * in the server (a handler called outside a request only queues: lib/mail/server/send.ts).
 */
const post = async (handler: (r: Request) => Promise<Response>, body: unknown, from = freshAddress()) => {
  const res = await withTrustProxy("1", () =>
    handler(new Request("http://test/api", { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json", "x-forwarded-for": from } })),
  );
  await drainMailQueue();
  return res;
};
const resend = async () => {
  const res = await resendRoute(new Request("http://test/api", { method: "POST", body: "{}" }));
  await drainMailQueue();
  return res.json();
};
const reply = async (res: Response) => ({ status: res.status, body: await res.json() });
const userRow = async (email: string) => (await db.select().from(users).where(eq(users.email, email)))[0]!;
const unique = (tag: string) => `${tag}-${crypto.randomUUID().slice(0, 8)}@example.com`;

describe("sign-up answers the same for a new and a taken address (#9)", () => {
  it("gives the same reply; the new address gets a verification link, the taken one's owner a notice", async () => {
    const taken = await makeAccount("taken", PASSWORD);
    const fresh = unique("fresh");
    const a = await reply(await post(signUpRoute, { name: "New Pilot", email: fresh, password: "ridge-soarer-42" }));
    const b = await reply(await post(signUpRoute, { name: "Someone Else", email: taken, password: "ridge-soarer-42" }));
    expect(a).toEqual({ status: 201, body: { ok: true } });
    expect(b).toEqual(a);

    const [verify] = await waitForMail(fresh);
    expect(verify!.subject).toMatch(/Confirm your e-mail address/);
    expect(verify!.html).toContain("Windowcall");
    const [notice] = await waitForMail(taken);
    expect(notice!.subject).toMatch(/tried to create an account/);
    expect(linkIn(notice!, "/forgot-password").url.searchParams.get("email")).toBe(taken);
    // the taken account is untouched: its owner's password still signs in, the stranger's does not
    expect(await withTrustProxy("1", () => attempt(taken, PASSWORD, freshAddress()))).toBe("signed in");
    expect(await withTrustProxy("1", () => attempt(taken, "ridge-soarer-42", freshAddress()))).toBe("wrong");
  });

  it("the verification link verifies the address once; a second use fails with a message", async () => {
    const email = unique("verify");
    await post(signUpRoute, { name: "Verify Me", email, password: "ridge-soarer-42" });
    expect((await userRow(email)).emailVerifiedAt).toBeNull();
    const { token } = linkIn((await waitForMail(email))[0]!, "/verify-email");
    expect((await post(verifyRoute, { token })).status).toBe(200);
    expect((await userRow(email)).emailVerifiedAt).not.toBeNull();
    const again = await reply(await post(verifyRoute, { token }));
    expect(again.status).toBe(410);
    expect(again.body.error.message).toMatch(/already used/);
    expect((await post(verifyRoute, { token: "x".repeat(43) })).status).toBe(404);
  });

  it("Settings can ask for the link again while the address is unverified", async () => {
    const email = unique("resend");
    await post(signUpRoute, { name: "Resend Me", email, password: "ridge-soarer-42" });
    const row = await userRow(email);
    actAs({ id: row.id, email, name: row.name, role: "member", sessionVersion: row.sessionVersion });
    expect(await resend()).toEqual({ sent: true });
    const mails = await waitForMail(email, 2);
    expect((await post(verifyRoute, { token: linkIn(mails[0]!, "/verify-email").token })).status).toBe(200);
    expect(await resend()).toEqual({ sent: false });
  });
});

describe("forgotten password (#14)", () => {
  it("answers the same whether or not the account exists, and mails only a real account", async () => {
    const real = await makeAccount("forgot", PASSWORD);
    const nobody = unique("nobody");
    const a = await reply(await post(forgotRoute, { email: real }));
    const b = await reply(await post(forgotRoute, { email: nobody }));
    expect(a).toEqual({ status: 202, body: { ok: true } });
    expect(b).toEqual(a);
    const [mail] = await waitForMail(real);
    expect(mail!.subject).toMatch(/Reset your password/);
    await new Promise((r) => setTimeout(r, 500));
    expect(await mailTo(nobody)).toEqual([]);
  });

  it("the link sets a new password once, ends every session, and fails the second time", async () => {
    const email = await makeAccount("reset", PASSWORD);
    const before = await userRow(email);
    await post(forgotRoute, { email });
    const { token } = linkIn((await waitForMail(email))[0]!, "/reset-password");
    expect((await post(resetRoute, { token, password: "new-thermal-77" })).status).toBe(200);
    const after = await userRow(email);
    expect(after.sessionVersion).toBe(before.sessionVersion + 1);
    expect(await withTrustProxy("1", () => attempt(email, "new-thermal-77", freshAddress()))).toBe("signed in");
    expect(await withTrustProxy("1", () => attempt(email, PASSWORD, freshAddress()))).toBe("wrong");
    const again = await reply(await post(resetRoute, { token, password: "another-one-88" }));
    expect(again.status).toBe(410);
    expect(again.body.error.message).toMatch(/already used/);
    expect(await withTrustProxy("1", () => attempt(email, "new-thermal-77", freshAddress()))).toBe("signed in");
  });

  it("an expired link fails with a message and changes nothing", async () => {
    const email = await makeAccount("expired", PASSWORD);
    await post(forgotRoute, { email });
    const { token } = linkIn((await waitForMail(email))[0]!, "/reset-password");
    const stored = (await db.select().from(emailTokens).where(eq(emailTokens.tokenHash, hashEmailToken(token))))[0]!;
    expect(stored.expiresAt.getTime() - stored.createdAt.getTime()).toBeLessThanOrEqual(60 * 60_000); // 30–60 minutes
    expect(stored.expiresAt.getTime() - stored.createdAt.getTime()).toBeGreaterThanOrEqual(30 * 60_000);
    await db.update(emailTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(emailTokens.id, stored.id));
    const res = await reply(await post(resetRoute, { token, password: "new-thermal-77" }));
    expect(res.status).toBe(410);
    expect(res.body.error.message).toMatch(/expired/);
    expect(await withTrustProxy("1", () => attempt(email, PASSWORD, freshAddress()))).toBe("signed in");
  });

  it("the database keeps only the token's hash", async () => {
    const email = await makeAccount("hashed", PASSWORD);
    await post(forgotRoute, { email });
    const { token } = linkIn((await waitForMail(email))[0]!, "/reset-password");
    const rows = await db.select().from(emailTokens).where(eq(emailTokens.userId, (await userRow(email)).id));
    expect(rows.map((r) => r.tokenHash)).toEqual([hashEmailToken(token)]);
    expect(JSON.stringify(rows)).not.toContain(token);
  });

  it("is limited per typed address, whether or not it has an account (429 after 5 an hour)", async () => {
    for (const email of [await makeAccount("flood", PASSWORD), unique("flood-nobody")]) {
      const statuses = [];
      for (let i = 0; i < 6; i++) statuses.push((await post(forgotRoute, { email })).status);
      expect(statuses).toEqual([202, 202, 202, 202, 202, 429]);
    }
  });
});
