import "server-only";
import { drainMailQueue } from "./drain";

const EVERY_MS = 30_000;
const state = globalThis as unknown as { windowcallMailTimer?: NodeJS.Timeout };

/** Drains the queue every 30 s in this process (once per process; the timer does not keep it alive). */
export function startMailTimer(): void {
  if (state.windowcallMailTimer || !process.env.DATABASE_URL) return;
  let running = false;
  state.windowcallMailTimer = setInterval(() => {
    if (running) return;
    running = true;
    void drainMailQueue().finally(() => (running = false));
  }, EVERY_MS);
  state.windowcallMailTimer.unref();
}
