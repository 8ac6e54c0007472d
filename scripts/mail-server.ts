// The local SMTP fake: an SMTP server (smtp-server) on 127.0.0.1 that keeps every message it
// receives (parsed by mailparser) in memory and in $MAIL_DIR/messages.json, and shows them on a
// loopback HTTP port: GET /messages[?to=address] (newest first), DELETE /messages, GET /health.
// Started and stopped by scripts/lib.sh (mail_up / mail_stop); never used in production.
//   MAIL_SMTP_PORT, MAIL_HTTP_PORT  ports to listen on (127.0.0.1 only)
//   MAIL_DIR                        where messages.json lives (created if missing)
import { mkdirSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import { createServer } from "node:http";
import { join } from "node:path";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";

type Stored = { id: number; to: string[]; from: string; subject: string; text: string; html: string; receivedAt: string };

const KEEP = 500;
const smtpPort = Number(process.env.MAIL_SMTP_PORT);
const httpPort = Number(process.env.MAIL_HTTP_PORT);
const dir = process.env.MAIL_DIR ?? ".data/mail";
const file = join(dir, "messages.json");
mkdirSync(dir, { recursive: true });

let messages: Stored[] = [];
try {
  messages = JSON.parse(readFileSync(file, "utf8")) as Stored[];
} catch {
  messages = [];
}
let nextId = messages.reduce((m, x) => Math.max(m, x.id), 0) + 1;

function save(): void {
  writeFileSync(`${file}.tmp`, JSON.stringify(messages.slice(-KEEP)));
  renameSync(`${file}.tmp`, file);
}

const addresses = (a: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((x) => x.value.map((v) => (v.address ?? "").toLowerCase()));

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const envelope = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
        messages.push({
          id: nextId++,
          to: envelope.length ? envelope : addresses(mail.to),
          from: addresses(mail.from)[0] ?? "",
          subject: mail.subject ?? "",
          text: mail.text ?? "",
          html: typeof mail.html === "string" ? mail.html : "",
          receivedAt: new Date().toISOString(),
        });
        if (messages.length > KEEP) messages = messages.slice(-KEEP);
        save();
        callback();
      })
      .catch((error: Error) => callback(error));
  },
});

const http = createServer((req, res) => {
  const url = new URL(req.url ?? "/", "http://127.0.0.1");
  const reply = (status: number, body: unknown) => {
    res.writeHead(status, { "content-type": "application/json", "cache-control": "no-store" });
    res.end(JSON.stringify(body));
  };
  if (url.pathname === "/health") return reply(200, { ok: true, smtpPort });
  if (url.pathname !== "/messages") return reply(404, { error: "not found" });
  if (req.method === "DELETE") {
    messages = [];
    save();
    return reply(200, { ok: true });
  }
  const to = url.searchParams.get("to")?.toLowerCase();
  return reply(200, [...messages].reverse().filter((m) => !to || m.to.includes(to)));
});

smtp.on("error", (e) => console.error("[mail] smtp error", e.message));
smtp.listen(smtpPort, "127.0.0.1", () => {
  http.listen(httpPort, "127.0.0.1", () => console.log(`[mail] SMTP on 127.0.0.1:${smtpPort}, mailbox on http://127.0.0.1:${httpPort}`));
});
const stop = () => {
  http.close();
  smtp.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
