import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { devMailboxUrl, splitLinks, type DevMessage } from "@/lib/mail/dev-mailbox";

export const metadata: Metadata = { title: "Mailbox (development)", robots: { index: false } };
export const dynamic = "force-dynamic";

/**
 * Every message the local SMTP fake received, newest first, with clickable links. Present only when
 * the app sends to that fake (DEV_MAILBOX_URL, set by npm start and the test scripts); 404 otherwise.
 */
export default async function DevMailboxPage() {
  const base = devMailboxUrl();
  if (!base) notFound();
  const messages = (await fetch(`${base}/messages`, { cache: "no-store" })
    .then((r) => r.json())
    .catch(() => null)) as DevMessage[] | null;

  return (
    <main className="mx-auto max-w-2xl space-y-6 px-4 py-8">
      <h1 className="text-2xl font-extrabold">Mailbox</h1>
      <p className="text-muted">
        Development only: what Windowcall sent to the local mail server. Nothing here left this machine.
      </p>
      {messages === null ? <p role="alert">The local mail server does not answer.</p> : null}
      {messages?.length === 0 ? <p>No messages yet.</p> : null}
      <ol className="space-y-4">
        {messages?.map((m) => (
          <li key={m.id}>
            <article aria-label={m.subject} className="space-y-2 rounded-lg border-2 border-line p-4">
              <h2 className="font-bold">{m.subject}</h2>
              <p className="text-sm text-muted">
                To {m.to.join(", ")} · <time dateTime={m.receivedAt}>{new Date(m.receivedAt).toISOString().replace("T", " ").slice(0, 19)} UTC</time>
              </p>
              <p className="whitespace-pre-wrap break-words">
                {splitLinks(m.text).map((part, i) =>
                  part.href ? (
                    <a key={i} href={part.href} className="font-semibold underline">
                      {part.text}
                    </a>
                  ) : (
                    <span key={i}>{part.text}</span>
                  ),
                )}
              </p>
            </article>
          </li>
        ))}
      </ol>
    </main>
  );
}
