/**
 * The one look of every e-mail: plain text, and simple HTML with the app's name on top. Pure (no
 * framework, no I/O), so messages are unit-tested as data.
 */
export const APP_NAME = "Windowcall";

export type Mail = { kind: string; subject: string; text: string; html: string };

/** A paragraph of a message: plain text, or a link with its label. */
export type Block = string | { link: string; label: string };

export function escapeHtml(s: string): string {
  return s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");
}

/**
 * Builds both bodies. Transactional messages (account links and notices) have no unsubscribe line;
 * any other kind must pass `unsubscribe` (the address that stops it), which both bodies then end with.
 */
export function compose(kind: string, subject: string, blocks: Block[], opts: { unsubscribe?: string } = {}): Mail {
  const text = [
    ...blocks.map((b) => (typeof b === "string" ? b : `${b.label}:\n${b.link}`)),
    `— ${APP_NAME}`,
    ...(opts.unsubscribe ? [`To stop these e-mails, open ${opts.unsubscribe}`] : []),
  ].join("\n\n");
  const paragraphs = blocks.map((b) =>
    typeof b === "string"
      ? `<p>${escapeHtml(b)}</p>`
      : `<p><a href="${escapeHtml(b.link)}">${escapeHtml(b.label)}</a><br><small>${escapeHtml(b.link)}</small></p>`,
  );
  const footer = opts.unsubscribe
    ? `<p style="color:#666;font-size:12px"><a href="${escapeHtml(opts.unsubscribe)}">Unsubscribe</a> from these e-mails.</p>`
    : "";
  const html = [
    `<!doctype html><html><body style="font-family:sans-serif;max-width:36em;margin:auto;line-height:1.5">`,
    `<p style="font-size:20px;font-weight:800">${APP_NAME}</p>`,
    ...paragraphs,
    footer,
    `</body></html>`,
  ].join("\n");
  return { kind, subject: `${subject} — ${APP_NAME}`, text: `${text}\n`, html };
}
