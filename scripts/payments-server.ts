// The local payments fake: a node:http server on 127.0.0.1 that answers the few calls of the payments
// API (Stripe's REST shapes) that Windowcall makes through the `stripe` SDK, serves a simple hosted
// checkout page, and sends signed webhooks back to the app. Started and stopped by scripts/lib.sh
// (payments_up / fakes_stop_if_started); never used in production, where the SDK talks to the real API.
//   PAYMENTS_PORT                 port to listen on (127.0.0.1 only)
//   PAYMENTS_DIR                  where state.json lives (sessions, payments, refunds, events)
//   STRIPE_SECRET_KEY             the API key the app must send (Authorization: Bearer …); others get 401
//   STRIPE_WEBHOOK_SECRET         the signing secret of the webhooks it sends
//   PAYMENTS_RETRY_MS             first wait before a failed webhook is sent again (default 1000; doubles each time)
//   PAYMENTS_ATTEMPTS             how many times a webhook is tried in all (default 6)
//
// The API (form-encoded bodies, JSON replies, errors as { error: { type, code, message } }):
//   POST /v1/checkout/sessions            create (mode, line_items[0][price_data], client_reference_id,
//                                         metadata, payment_intent_data[metadata], success_url, cancel_url,
//                                         expires_at: 30 minutes to 24 hours ahead, 24 hours when left out)
//   GET  /v1/checkout/sessions/:id        retrieve
//   POST /v1/refunds                      create (payment_intent, optional amount; whole refunds only)
// A repeated Idempotency-Key on a POST returns the first reply, as the real API does.
//
// The hosted page GET /pay/:sessionId shows the amount with two buttons: "Pay" succeeds, "Decline the card"
// fails (the session stays open: the page says so and offers both again, and a link back to cancel_url).
// Tests drive the same page by POST /pay/:sessionId with outcome=pay or outcome=decline.
//
// A session past its expires_at closes (status "expired", no page to pay on) and sends checkout.session.expired.
//
// Webhooks: each event (checkout.session.completed, checkout.session.expired, payment_intent.payment_failed,
// charge.refunded) is
// POSTed, before the page redirects, to the origin of the session's success_url + /api/payments/webhook
// (the real service sends them to the endpoint set in its dashboard), signed like the real service:
// header Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<body>" keyed by the secret>.
// An answer other than 2xx (or none) is retried with waits doubling from PAYMENTS_RETRY_MS, as the real
// service retries for days; each try is signed anew.
// Control (tests only): GET /_fake/events (newest first, with body, signature header as last sent, attempts),
// POST /_fake/events/:id/redeliver (the same body, signed anew), POST /_fake/sessions/:id/expire (its
// expiry comes now), GET /health.
import { createHmac, randomBytes } from "node:crypto";
import { mkdirSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import { join } from "node:path";

type Obj = Record<string, unknown>;
type Session = {
  id: string; object: "checkout.session"; url: string | null; status: "open" | "complete" | "expired"; payment_status: "unpaid" | "paid";
  mode: string; amount_total: number; currency: string; client_reference_id: string | null; metadata: Obj;
  payment_intent: string | null; success_url: string; cancel_url: string | null; created: number; livemode: false;
  product: string; intent_metadata: Obj; declined: number; expires_at: number;
};
type Payment = { id: string; object: "payment_intent"; amount: number; currency: string; status: string; metadata: Obj; session: string; refunded: number; charge: string };
type Sent = { id: string; type: string; body: string; signature: string; target: string; status: number | string; created: number; attempts: number };
type State = { sessions: Record<string, Session>; payments: Record<string, Payment>; events: Sent[]; idempotent: Record<string, { status: number; body: unknown }> };

const port = Number(process.env.PAYMENTS_PORT);
const dir = process.env.PAYMENTS_DIR ?? ".data/payments";
const apiKey = process.env.STRIPE_SECRET_KEY ?? "";
const webhookSecret = process.env.STRIPE_WEBHOOK_SECRET ?? "";
const retryMs = Number(process.env.PAYMENTS_RETRY_MS ?? 1000);
const attemptsInAll = Number(process.env.PAYMENTS_ATTEMPTS ?? 6);
if (!port || !apiKey || !webhookSecret) {
  console.error("[payments] PAYMENTS_PORT, STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET are needed");
  process.exit(1);
}
const file = join(dir, "state.json");
mkdirSync(dir, { recursive: true });
let state: State = { sessions: {}, payments: {}, events: [], idempotent: {} };
try {
  state = JSON.parse(readFileSync(file, "utf8")) as State;
} catch {
  /* a fresh start */
}
function save(): void {
  state.events = state.events.slice(-500);
  const keys = Object.keys(state.idempotent);
  for (const k of keys.slice(0, Math.max(0, keys.length - 1000))) delete state.idempotent[k];
  writeFileSync(`${file}.tmp`, JSON.stringify(state));
  renameSync(`${file}.tmp`, file);
}

const newId = (prefix: string) => `${prefix}_test_${randomBytes(12).toString("hex")}`;
const now = () => Math.floor(Date.now() / 1000);

/** Form-encoded body with bracketed keys (a[b][0][c]=v) into nested objects and arrays, as the SDK encodes them. */
export function parseForm(body: string): Obj {
  const out: Obj = {};
  for (const [key, value] of new URLSearchParams(body)) {
    const path = key.split(/\[|\]\[|\]/).filter((p) => p !== "");
    let at: Obj = out;
    path.forEach((p, i) => {
      if (i === path.length - 1) at[p] = value;
      else at = (at[p] ??= {}) as Obj;
    });
  }
  return out;
}

function reply(res: ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { "content-type": "application/json", "cache-control": "no-store", "request-id": newId("req") });
  res.end(JSON.stringify(body));
}
const apiError = (res: ServerResponse, status: number, code: string, message: string, param?: string) =>
  reply(res, status, { error: { type: status === 401 ? "authentication_error" : "invalid_request_error", code, message, ...(param ? { param } : {}) } });

function readBody(req: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    let size = 0;
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => {
      size += c.length;
      if (size > 256 * 1024) req.destroy(new Error("body too large"));
      else chunks.push(c);
    });
    req.on("end", () => resolve(Buffer.concat(chunks).toString("utf8")));
    req.on("error", reject);
  });
}

/** The signature header of the real service's scheme (its "v1" scheme). */
function sign(body: string, t = now()): string {
  return `t=${t},v1=${createHmac("sha256", webhookSecret).update(`${t}.${body}`, "utf8").digest("hex")}`;
}

/** Sends one event; an answer other than 2xx (or none) is tried again later, up to PAYMENTS_ATTEMPTS tries in all. */
async function deliver(sent: Sent): Promise<void> {
  sent.signature = sign(sent.body);
  sent.attempts = (sent.attempts ?? 0) + 1;
  try {
    const r = await fetch(sent.target, { method: "POST", headers: { "content-type": "application/json", "stripe-signature": sent.signature }, body: sent.body, signal: AbortSignal.timeout(10_000) });
    await r.arrayBuffer();
    sent.status = r.status;
  } catch (e) {
    sent.status = `not delivered: ${(e as Error).message}`;
  }
  console.log(`[payments] ${sent.type} ${sent.id} → ${sent.target}: ${sent.status} (try ${sent.attempts})`);
  save();
  const delivered = typeof sent.status === "number" && sent.status >= 200 && sent.status < 300;
  if (!delivered && sent.attempts < attemptsInAll) {
    setTimeout(() => void deliver(sent), retryMs * 2 ** (sent.attempts - 1)).unref();
  }
}

async function sendEvent(session: Session, type: string, object: Obj): Promise<void> {
  const id = newId("evt");
  const event = { id, object: "event", api_version: "2025-01-01", created: now(), livemode: false, pending_webhooks: 1, type, data: { object } };
  let target: string;
  try {
    target = `${new URL(session.success_url).origin}/api/payments/webhook`;
  } catch {
    return;
  }
  const sent: Sent = { id, type, body: JSON.stringify(event), signature: "", target, status: "pending", created: event.created, attempts: 0 };
  state.events.push(sent);
  await deliver(sent);
}

/** The fields the API shows (the rest is the fake's own bookkeeping). */
const pick = <T extends Obj>(o: T, hidden: string[]) => Object.fromEntries(Object.entries(o).filter(([k]) => !hidden.includes(k)));
const publicSession = (s: Session) => pick(s, ["product", "intent_metadata", "declined"]);

/** Closes every open session past its expiry, telling the app (checkout.session.expired). */
async function expireDue(): Promise<void> {
  for (const s of Object.values(state.sessions)) {
    if (s.status !== "open" || s.expires_at > now()) continue;
    s.status = "expired";
    s.url = null;
    save();
    await sendEvent(s, "checkout.session.expired", publicSession(s));
  }
}
setInterval(() => void expireDue(), 1000).unref();
const publicPayment = (p: Payment) => ({ ...pick(p, ["session", "refunded", "charge"]), latest_charge: p.charge, amount_received: p.status === "succeeded" ? p.amount : 0 });

function createSession(res: ServerResponse, f: Obj): void {
  const item = ((f.line_items as Obj | undefined)?.["0"] ?? {}) as Obj;
  const price = (item.price_data ?? {}) as Obj;
  const amount = Number(price.unit_amount) * Number(item.quantity ?? 1);
  if (f.mode !== "payment") return apiError(res, 400, "parameter_invalid_string", "Only mode=payment is implemented by this fake.", "mode");
  if (!Number.isInteger(amount) || amount < 50) return apiError(res, 400, "amount_too_small", "line_items[0][price_data][unit_amount] must be an integer of at least 50.", "line_items");
  if (typeof price.currency !== "string" || !/^[a-z]{3}$/.test(price.currency)) return apiError(res, 400, "parameter_invalid_string", "Give a three-letter currency.", "currency");
  if (typeof f.success_url !== "string" || !/^https?:\/\//.test(f.success_url)) return apiError(res, 400, "url_invalid", "success_url must be an http(s) URL.", "success_url");
  const expiresAt = f.expires_at === undefined ? now() + 24 * 3600 : Number(f.expires_at);
  if (!Number.isInteger(expiresAt) || expiresAt < now() + 30 * 60 || expiresAt > now() + 24 * 3600) {
    return apiError(res, 400, "parameter_invalid_integer", "expires_at must be 30 minutes to 24 hours after the session is created.", "expires_at");
  }
  const id = newId("cs");
  const session: Session = {
    id, object: "checkout.session", url: `http://127.0.0.1:${port}/pay/${id}`, status: "open", payment_status: "unpaid", mode: "payment",
    amount_total: amount, currency: price.currency, client_reference_id: typeof f.client_reference_id === "string" ? f.client_reference_id : null,
    metadata: (f.metadata ?? {}) as Obj, payment_intent: null, success_url: f.success_url, cancel_url: typeof f.cancel_url === "string" ? f.cancel_url : null,
    created: now(), livemode: false, product: String((price.product_data as Obj | undefined)?.name ?? "Payment"),
    intent_metadata: (((f.payment_intent_data as Obj | undefined)?.metadata) ?? {}) as Obj, declined: 0, expires_at: expiresAt,
  };
  state.sessions[id] = session;
  save();
  reply(res, 200, publicSession(session));
}

async function refund(res: ServerResponse, f: Obj): Promise<void> {
  const payment = typeof f.payment_intent === "string" ? state.payments[f.payment_intent] : undefined;
  if (!payment) return apiError(res, 404, "resource_missing", `No such payment_intent: '${String(f.payment_intent)}'`, "payment_intent");
  if (payment.status !== "succeeded") return apiError(res, 400, "payment_intent_unexpected_state", "This payment has not succeeded; there is nothing to refund.");
  if (payment.refunded >= payment.amount) return apiError(res, 400, "charge_already_refunded", `Charge ${payment.charge} has already been refunded.`);
  const amount = f.amount === undefined ? payment.amount - payment.refunded : Number(f.amount);
  if (amount !== payment.amount - payment.refunded) return apiError(res, 400, "parameter_invalid_integer", "This fake refunds whole payments only.", "amount");
  payment.refunded += amount;
  const out = { id: newId("re"), object: "refund", amount, currency: payment.currency, payment_intent: payment.id, charge: payment.charge, status: "succeeded", metadata: (f.metadata ?? {}) as Obj, created: now() };
  save();
  reply(res, 200, out);
  const session = state.sessions[payment.session];
  if (session) {
    await sendEvent(session, "charge.refunded", {
      id: payment.charge, object: "charge", amount: payment.amount, amount_refunded: payment.refunded, currency: payment.currency,
      payment_intent: payment.id, refunded: payment.refunded >= payment.amount, metadata: payment.metadata, status: "succeeded",
    });
  }
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
function page(res: ServerResponse, s: Session, note = ""): void {
  const money = `${(s.amount_total / 100).toFixed(2)} ${s.currency.toUpperCase()}`;
  const done = s.status !== "open";
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Test payment</title><style>body{font-family:sans-serif;max-width:28rem;margin:2rem auto;padding:0 1rem}button{min-height:48px;width:100%;margin:.5rem 0;font-size:1rem}a{display:inline-block;min-height:48px;line-height:48px}</style></head>
<body><main><h1>Test payment</h1><p>This is Windowcall's local payments fake: no money moves.</p>
<p>${esc(s.product)}: <strong>${esc(money)}</strong></p>${note ? `<p role="alert">${esc(note)}</p>` : ""}
${done ? `<p>This payment is ${s.payment_status === "paid" ? "paid" : s.status === "expired" ? "expired: start again from Windowcall" : "closed"}.</p>` : `<form method="post" action="/pay/${esc(s.id)}">
<button name="outcome" value="pay">Pay ${esc(money)}</button><button name="outcome" value="decline">Decline the card</button></form>`}
${s.cancel_url ? `<p><a href="${esc(s.cancel_url)}">Back to Windowcall without paying</a></p>` : ""}</main></body></html>`;
  res.writeHead(200, { "content-type": "text/html; charset=utf-8", "cache-control": "no-store" });
  res.end(html);
}

async function pay(res: ServerResponse, s: Session, outcome: string): Promise<void> {
  if (s.status === "open" && s.expires_at <= now()) await expireDue();
  if (s.status !== "open") return page(res, s, s.status === "expired" ? "This payment page has expired." : "This payment is already closed.");
  const intent: Payment = {
    id: newId("pi"), object: "payment_intent", amount: s.amount_total, currency: s.currency, status: "requires_payment_method",
    metadata: s.intent_metadata, session: s.id, refunded: 0, charge: newId("ch"),
  };
  state.payments[intent.id] = intent;
  s.payment_intent = intent.id;
  if (outcome === "decline") {
    s.declined += 1;
    save();
    await sendEvent(s, "payment_intent.payment_failed", {
      ...publicPayment(intent), last_payment_error: { type: "card_error", code: "card_declined", decline_code: "generic_decline", message: "Your card was declined." },
    });
    return page(res, s, "Your card was declined. Try again, or go back without paying.");
  }
  intent.status = "succeeded";
  s.status = "complete";
  s.payment_status = "paid";
  s.url = null;
  save();
  await sendEvent(s, "checkout.session.completed", publicSession(s));
  res.writeHead(303, { location: s.success_url.replace("{CHECKOUT_SESSION_ID}", s.id) });
  res.end();
}

const server = createServer((req, res) => {
  void (async () => {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    const parts = url.pathname.split("/").filter(Boolean);
    if (url.pathname === "/health") return reply(res, 200, { ok: true });
    if (parts[0] === "_fake" && parts[1] === "events") {
      if (req.method === "GET" && parts.length === 2) return reply(res, 200, [...state.events].reverse());
      const sent = state.events.find((e) => e.id === parts[2]);
      if (req.method === "POST" && sent && parts[3] === "redeliver") {
        await deliver(sent);
        return reply(res, 200, sent);
      }
      return reply(res, 404, { error: "no such event" });
    }
    if (parts[0] === "_fake" && parts[1] === "sessions" && parts[3] === "expire" && req.method === "POST") {
      const s = state.sessions[parts[2] ?? ""];
      if (!s) return reply(res, 404, { error: "no such session" });
      s.expires_at = Math.min(s.expires_at, now());
      await expireDue();
      return reply(res, 200, publicSession(s));
    }
    if (parts[0] === "pay" && parts[1]) {
      const s = state.sessions[parts[1]];
      if (!s) {
        res.writeHead(404, { "content-type": "text/plain" });
        return res.end("No such payment.");
      }
      if (req.method === "POST") return pay(res, s, new URLSearchParams(await readBody(req)).get("outcome") ?? "");
      return page(res, s);
    }
    if (parts[0] !== "v1") return reply(res, 404, { error: "not found" });
    if (req.headers.authorization !== `Bearer ${apiKey}`) return apiError(res, 401, "api_key_invalid", "Invalid API Key provided.");
    const body = req.method === "POST" ? await readBody(req) : "";
    const key = req.method === "POST" ? req.headers["idempotency-key"] : undefined;
    const remembered = typeof key === "string" ? state.idempotent[`${url.pathname}|${key}`] : undefined;
    if (remembered) return reply(res, remembered.status, remembered.body);
    if (typeof key === "string") {
      // remember this request's reply under its key
      const end = res.end.bind(res);
      res.end = ((chunk?: unknown) => {
        if (typeof chunk === "string") state.idempotent[`${url.pathname}|${key}`] = { status: res.statusCode, body: JSON.parse(chunk) as unknown };
        return end(chunk as string);
      }) as typeof res.end;
    }
    const f = parseForm(body);
    const route = `${req.method} /${parts.slice(0, 3).join("/")}`;
    if (route === "POST /v1/checkout/sessions" && parts.length === 3) return createSession(res, f);
    if (route === "GET /v1/checkout/sessions" && parts.length === 4) {
      const s = state.sessions[parts[3]!];
      return s ? reply(res, 200, publicSession(s)) : apiError(res, 404, "resource_missing", `No such checkout.session: '${parts[3]}'`, "id");
    }
    if (req.method === "POST" && url.pathname === "/v1/refunds") return refund(res, f);
    return apiError(res, 404, "resource_missing", `Unrecognized request URL (${req.method}: ${url.pathname}); this fake implements only the calls Windowcall makes.`);
  })().catch((e: Error) => {
    console.error("[payments] error", e);
    if (!res.headersSent) reply(res, 500, { error: { type: "api_error", message: e.message } });
  });
});

server.listen(port, "127.0.0.1", () => console.log(`[payments] fake payments API on http://127.0.0.1:${port}`));
const stop = () => {
  server.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
