/** One line of the admin audit log in words, e.g. "disabled ada@example.com". */

export type AuditEntry = {
  action: "user.disable" | "user.enable" | "user.role" | "mail.retry";
  detail: { fromRole?: string; toRole?: string; attempts?: number };
  targetEmail: string | null;
  targetMailTo: string | null;
};

const GONE = "a removed record";

/** What the admin did, after their name ("Site Admin disabled …"). */
export function describeAdminAction(entry: AuditEntry): string {
  const who = entry.targetEmail ?? GONE;
  switch (entry.action) {
    case "user.disable":
      return `disabled ${who}`;
    case "user.enable":
      return `re-enabled ${who}`;
    case "user.role":
      return `changed the site role of ${who} from ${entry.detail.fromRole ?? "?"} to ${entry.detail.toRole ?? "?"}`;
    case "mail.retry": {
      const tries = entry.detail.attempts;
      const after = tries === undefined ? "" : ` (after ${tries} ${tries === 1 ? "attempt" : "attempts"})`;
      return `sent the e-mail to ${entry.targetMailTo ?? GONE} again${after}`;
    }
  }
}
