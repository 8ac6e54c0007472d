/**
 * The development mailbox: the local SMTP fake's message list (scripts/mail-server.ts), which our
 * scripts name in DEV_MAILBOX_URL. Only a loopback address counts, so a production environment that
 * sets it by mistake to anything else still has no mailbox page.
 */
export type DevMessage = { id: number; to: string[]; from: string; subject: string; text: string; receivedAt: string };

export function devMailboxUrl(env: Record<string, string | undefined> = process.env): string | null {
  const raw = env.DEV_MAILBOX_URL;
  if (!raw) return null;
  try {
    const url = new URL(raw);
    return url.protocol === "http:" && ["127.0.0.1", "localhost", "[::1]"].includes(url.hostname) ? url.origin : null;
  } catch {
    return null;
  }
}

/** Splits text into plain parts and links (http/https), so a page can make the links clickable. */
export function splitLinks(text: string): { text: string; href?: string }[] {
  const out: { text: string; href?: string }[] = [];
  let at = 0;
  for (const m of text.matchAll(/https?:\/\/[^\s<>"]+/g)) {
    if (m.index > at) out.push({ text: text.slice(at, m.index) });
    out.push({ text: m[0], href: m[0] });
    at = m.index + m[0].length;
  }
  if (at < text.length) out.push({ text: text.slice(at) });
  return out;
}
