import "server-only";
import { after } from "next/server";
import { db } from "@/db";
import { enqueueMail } from "@/db/queries/mail-queue";
import { drainMailQueue } from "./drain";
import type { Mail } from "../layout";

/**
 * Queues a message for `to` and drains the queue once the response has gone (Next's after()), so a
 * request never waits on the mail server and a failed send stays queued for the periodic drain
 * (instrumentation.ts). Outside a request (tests calling a handler directly, scripts) after() is not
 * available: the message waits for the periodic drain, or for the caller's own drainMailQueue().
 */
export async function sendMail(to: string, mail: Mail): Promise<void> {
  await enqueueMail(db, { to, ...mail });
  try {
    after(() => drainMailQueue());
  } catch {
    // outside a request scope: nothing in flight here can outlive the caller (a test's pool, a script)
  }
}
