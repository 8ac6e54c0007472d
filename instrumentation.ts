/**
 * Runs once when the server starts (Next's instrumentation hook). In the Node.js runtime it starts
 * the mail queue's periodic drain, which sends what a request's own drain could not (the mail server
 * was down, a retry came due). See DEVELOPERS.md, "E-mail".
 */
export async function register() {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    const { startMailTimer } = await import("./lib/mail/server/timer");
    startMailTimer();
  }
}
