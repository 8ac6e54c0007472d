import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { POST as retryRoute } from "@/app/api/admin/mail/[mailId]/retry/route";
import { adminActions, mailQueue } from "@/db/schema";
import { drainMailQueue } from "@/lib/mail/server/drain";
import { MAX_MAIL_ATTEMPTS } from "@/lib/mail/backoff";
import { actAs } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { waitForMail } from "./support/mailbox";

/** An admin sends a failed message again from /admin; the drain then delivers it to the local SMTP fake. */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

const rowOf = async (id: string) => (await db.select().from(mailQueue).where(eq(mailQueue.id, id)))[0]!;
const retry = (mailId: string, body: unknown = {}) =>
  retryRoute(new Request(`http://test/api/admin/mail/${mailId}/retry`, { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } }), {
    params: Promise.resolve({ mailId }),
  });

async function queued(state: "failed" | "sent"): Promise<{ id: string; to: string }> {
  const to = `admin-retry-${crypto.randomUUID().slice(0, 8)}@example.com`;
  const [row] = await db
    .insert(mailQueue)
    .values({
      to, subject: "Your field day summary", text: "Plain text", html: "<p>Plain text</p>", kind: "test",
      ...(state === "failed"
        ? { attempts: MAX_MAIL_ATTEMPTS, nextAttemptAt: null, lastError: "Greeting never received" }
        : { attempts: 1, nextAttemptAt: null, sentAt: new Date() }),
    })
    .returning();
  return { id: row!.id, to };
}

describe("POST /api/admin/mail/[mailId]/retry", () => {
  it("makes a message the drain gave up on due again, audits it, and the next drain delivers it", async () => {
    const admin = await freshUser("mail-admin", { role: "admin" });
    const mail = await queued("failed");
    expect(await drainMailQueue().then(() => rowOf(mail.id))).toMatchObject({ sentAt: null, attempts: MAX_MAIL_ATTEMPTS });

    actAs(admin);
    const res = await retry(mail.id);
    expect(res.status).toBe(202);
    expect(await rowOf(mail.id)).toMatchObject({ attempts: 0, sentAt: null });
    const audit = await db.select().from(adminActions).where(eq(adminActions.targetMailId, mail.id));
    expect(audit).toEqual([expect.objectContaining({ actorId: admin.id, action: "mail.retry", detail: { attempts: MAX_MAIL_ATTEMPTS } })]);

    await drainMailQueue();
    expect((await rowOf(mail.id)).sentAt).not.toBeNull();
    const [received] = await waitForMail(mail.to);
    expect(received!.subject).toBe("Your field day summary");
  });

  it("refuses a message that was sent (409) or does not exist (404), changing nothing", async () => {
    const admin = await freshUser("mail-admin-refused", { role: "admin" });
    const sent = await queued("sent");
    const before = await rowOf(sent.id);
    actAs(admin);
    expect((await retry(sent.id)).status).toBe(409);
    expect((await retry(crypto.randomUUID())).status).toBe(404);
    expect((await retry("not-a-uuid")).status).toBe(404);
    expect((await retry(sent.id, [])).status).toBe(422);
    expect(await rowOf(sent.id)).toEqual(before);
    expect(await db.select().from(adminActions).where(eq(adminActions.targetMailId, sent.id))).toEqual([]);
  });

  it("is 401 signed out and 403 for a member", async () => {
    const mail = await queued("failed");
    actAs(null);
    expect((await retry(mail.id)).status).toBe(401);
    actAs(await freshUser("mail-member"));
    expect((await retry(mail.id)).status).toBe(403);
    expect(await rowOf(mail.id)).toMatchObject({ attempts: MAX_MAIL_ATTEMPTS, nextAttemptAt: null });
  });
});
