import "server-only";
import { after } from "next/server";
import { drainMailQueue } from "./drain";

/**
 * Drains the mail queue once the response has gone (Next's after()). Outside a request scope (tests
 * calling a handler directly, scripts) after() is not available: the queue waits for the periodic drain.
 */
export function drainAfterResponse(): void {
  try {
    after(() => drainMailQueue());
  } catch {
    // no request scope: nothing here may outlive the caller
  }
}
