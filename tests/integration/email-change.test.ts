import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { users } from "@/db/schema";
import { GET as emailState, POST as changeRoute } from "@/app/api/account/email/route";
import { POST as confirmRoute } from "@/app/api/account/email/confirm/route";
import { drainMailQueue } from "@/lib/mail/server/drain";
import { hashPassword } from "@/lib/auth/password";
import { actAs } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { makeAccount } from "./support/accounts";
import { linkIn, mailTo, waitForMail } from "./support/mailbox";

/** Issue #14: changing the e-mail address needs the password, and happens only when the new address confirms. */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

const PASSWORD = "sink-and-climb-9";
const call = async (handler: (r: Request) => Promise<Response>, body: unknown) => {
  const res = await handler(new Request("http://test/api", { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } }));
  await drainMailQueue();
  return res;
};
const emailOf = async (id: string) => (await db.select().from(users).where(eq(users.id, id)))[0]!.email;
const unique = (tag: string) => `${tag}-${crypto.randomUUID().slice(0, 8)}@example.com`;

describe("change e-mail with confirmation", () => {
  it("refuses a wrong password and sends nothing", async () => {
    const me = await freshUser("change-wrong", { passwordHash: await hashPassword(PASSWORD) });
    actAs(me);
    const target = unique("change-target");
    const res = await call(changeRoute, { newEmail: target, currentPassword: "not-it-at-all" });
    expect(res.status).toBe(403);
    expect(await mailTo(target)).toEqual([]);
    expect(await emailOf(me.id)).toBe(me.email);
  });

  it("mails the new address; the address changes only when its link is followed, once; the old one is told", async () => {
    const me = await freshUser("change-ok", { passwordHash: await hashPassword(PASSWORD) });
    actAs(me);
    const target = unique("change-new");
    expect((await call(changeRoute, { newEmail: target, currentPassword: PASSWORD })).status).toBe(202);
    expect(await emailOf(me.id)).toBe(me.email);
    const [mail] = await waitForMail(target);
    expect(mail!.subject).toMatch(/Confirm your new e-mail address/);
    const { token } = linkIn(mail!, "/confirm-email");

    const res = await call(confirmRoute, { token });
    expect(res.status).toBe(200);
    expect(await emailOf(me.id)).toBe(target);
    actAs({ ...me, email: target });
    expect(await (await emailState()).json()).toEqual({ email: target, verified: true });
    const [notice] = await waitForMail(me.email);
    expect(notice!.subject).toMatch(/e-mail address was changed/);
    expect(notice!.text).toContain(target);

    const again = await call(confirmRoute, { token });
    expect(again.status).toBe(410);
    expect((await again.json()).error.message).toMatch(/already used/);
  });

  it("a new address another account holds by the time of confirming is refused with a message", async () => {
    const me = await freshUser("change-race", { passwordHash: await hashPassword(PASSWORD) });
    actAs(me);
    const target = unique("change-race-new");
    expect((await call(changeRoute, { newEmail: target, currentPassword: PASSWORD })).status).toBe(202);
    const { token } = linkIn((await waitForMail(target))[0]!, "/confirm-email");
    await db.insert(users).values({ email: target, name: "Quicker" });
    const res = await call(confirmRoute, { token });
    expect(res.status).toBe(409);
    expect(await emailOf(me.id)).toBe(me.email);
  });

  it("answers the same when another account holds the new address (revealing no account)", async () => {
    const me = await freshUser("change-taken", { passwordHash: await hashPassword(PASSWORD) });
    actAs(me);
    const taken = await makeAccount("change-holder", "whatever-pass-1");
    const a = await call(changeRoute, { newEmail: taken, currentPassword: PASSWORD });
    const b = await call(changeRoute, { newEmail: unique("change-free"), currentPassword: PASSWORD });
    expect({ status: a.status, body: await a.json() }).toEqual({ status: b.status, body: await b.json() });
  });
});
