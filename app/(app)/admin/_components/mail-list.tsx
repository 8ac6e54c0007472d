import { db } from "@/db";
import { listMailQueue } from "@/db/queries/admin-lists";
import { canRetryMail, mailState, type MailState } from "@/lib/admin/mail-state";
import { Empty } from "./admin-section";
import { ListPager, type AdminParams } from "./list-pager";
import { MailRetryButton } from "./mail-retry-button";
import { When } from "./when";

const LABEL: Record<MailState, string> = { sent: "Sent", queued: "Queued", retrying: "Failed, will retry", failed: "Failed, given up" };

/**
 * The e-mail queue: messages whose last try failed first, then the newest. Only the envelope shows
 * (addressee, subject, kind): the bodies hold one-time links that are their addressee's alone.
 */
export async function MailList({ page, params }: { page: number; params: AdminParams }) {
  const { rows: mails, more } = await listMailQueue(db, page);
  if (!mails.length) return <Empty>{page > 1 ? "No older e-mail." : "No e-mail has been queued."}</Empty>;
  return (
    <>
    <ul className="space-y-2" aria-label="Queued e-mail">
      {mails.map((m) => {
        const state = mailState(m);
        return (
          <li key={m.id} aria-label={`${m.subject} to ${m.to}`} className="space-y-1 rounded-lg border border-line bg-raised p-3">
            <p className="font-bold">{m.subject}</p>
            <p className="break-all text-sm">
              to {m.to} · {m.kind}
            </p>
            <p className={`text-sm font-semibold ${state === "failed" || state === "retrying" ? "text-danger" : ""}`}>
              {LABEL[state]} · {m.attempts} {m.attempts === 1 ? "attempt" : "attempts"}
            </p>
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm text-muted">
              <dt>Queued</dt>
              <dd><When date={m.createdAt} /></dd>
              <dt>{state === "sent" ? "Sent" : "Next try"}</dt>
              <dd>{state === "sent" ? <When date={m.sentAt} /> : state === "failed" ? "none (given up)" : <When date={m.nextAttemptAt} />}</dd>
              {m.lastError ? (
                <>
                  <dt>Last error</dt>
                  <dd className="break-all">{m.lastError}</dd>
                </>
              ) : null}
            </dl>
            {canRetryMail(m) ? <MailRetryButton mailId={m.id} to={m.to} /> : null}
          </li>
        );
      })}
    </ul>
    <ListPager params={params} param="mail" page={page} more={more} section="mail" label="e-mail queue" />
    </>
  );
}
