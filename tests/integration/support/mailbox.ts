/**
 * The local SMTP fake's message list (scripts/mail-server.ts), which scripts/integration-local.sh and
 * npm test start and name in DEV_MAILBOX_URL. Tests use their own unique addresses, so they never
 * clear it.
 */
export type Received = { id: number; to: string[]; from: string; subject: string; text: string; html: string; receivedAt: string };

function mailboxUrl(): string {
  const url = process.env.DEV_MAILBOX_URL;
  if (!url) throw new Error("DEV_MAILBOX_URL is not set: run integration tests through scripts/integration-local.sh or npm test");
  return url;
}

export async function mailTo(address: string): Promise<Received[]> {
  const res = await fetch(`${mailboxUrl()}/messages?to=${encodeURIComponent(address.toLowerCase())}`);
  return (await res.json()) as Received[];
}

/** Waits (up to 15 s) until `address` has received at least `count` messages; newest first. */
export async function waitForMail(address: string, count = 1): Promise<Received[]> {
  const until = Date.now() + 15_000;
  for (;;) {
    const got = await mailTo(address);
    if (got.length >= count) return got;
    if (Date.now() > until) throw new Error(`no mail for ${address} after 15 s (got ${got.length})`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The link to `path` in a message's text, and its token. */
export function linkIn(mail: Received, path: string): { url: URL; token: string } {
  const found = mail.text.match(/https?:\/\/\S+/g)?.map((u) => new URL(u)).find((u) => u.pathname === path);
  if (!found) throw new Error(`no ${path} link in "${mail.subject}"`);
  return { url: found, token: found.searchParams.get("token") ?? "" };
}
