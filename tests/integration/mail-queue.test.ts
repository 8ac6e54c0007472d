import { afterAll, describe, expect, it } from "vitest";
import { createServer, type Server } from "node:net";
import { eq } from "drizzle-orm";
import { mailQueue } from "@/db/schema";
import { enqueueMail } from "@/db/queries/mail-queue";
import { drainMailQueue } from "@/lib/mail/server/drain";
import { verifyEmailMail } from "@/lib/mail/messages";
import { db, getPool } from "./support/db";
import { waitForMail } from "./support/mailbox";

/** The mail queue: a send that fails is kept and tried again later, not lost. */

afterAll(async () => {
  await getPool().end();
});

const rowOf = async (id: string) => (await db.select().from(mailQueue).where(eq(mailQueue.id, id)))[0]!;

/** An SMTP "server" that refuses every connection's greeting (answers 554 and hangs up). */
async function refusingServer(): Promise<{ url: string; server: Server }> {
  const server = createServer((socket) => socket.end("554 no service here\r\n"));
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  const port = (server.address() as { port: number }).port;
  return { url: `smtp://127.0.0.1:${port}`, server };
}

describe("mail queue", () => {
  it("keeps a message whose send failed, with the error and a later retry, then sends it when the server is back", async () => {
    const to = `queue-${crypto.randomUUID().slice(0, 8)}@example.com`;
    const real = process.env.SMTP_URL;
    const down = await refusingServer();
    let id: string;
    try {
      process.env.SMTP_URL = down.url;
      id = await enqueueMail(db, { to, ...verifyEmailMail({ name: "Queue Test", link: "http://localhost/verify-email?token=x" }) });
      await drainMailQueue();
    } finally {
      process.env.SMTP_URL = real;
      down.server.close();
    }
    const failed = await rowOf(id);
    expect(failed.sentAt).toBeNull();
    expect(failed.attempts).toBe(1);
    expect(failed.lastError).toBeTruthy();
    expect(failed.nextAttemptAt!.getTime()).toBeGreaterThan(Date.now() + 30_000);

    await drainMailQueue(); // not due yet: nothing happens
    expect((await rowOf(id)).attempts).toBe(1);

    await db.update(mailQueue).set({ nextAttemptAt: new Date() }).where(eq(mailQueue.id, id));
    await drainMailQueue();
    const sent = await rowOf(id);
    expect(sent.sentAt).not.toBeNull();
    expect(sent.attempts).toBe(2);
    const [mail] = await waitForMail(to);
    expect(mail!.subject).toBe("Confirm your e-mail address — Windowcall");
    expect(mail!.text).toContain("http://localhost/verify-email?token=x");
  });

  it("two drains at once send a message once", async () => {
    const to = `queue-once-${crypto.randomUUID().slice(0, 8)}@example.com`;
    const id = await enqueueMail(db, { to, ...verifyEmailMail({ name: "Once", link: "http://localhost/x" }) });
    await Promise.all([drainMailQueue(), drainMailQueue(), drainMailQueue()]);
    expect((await rowOf(id)).attempts).toBe(1);
    await new Promise((r) => setTimeout(r, 300));
    expect(await waitForMail(to)).toHaveLength(1);
  });
});
