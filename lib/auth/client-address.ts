/**
 * The client's address as far as we can trust it, or null when we cannot see it.
 *
 * Next 16 gives route handlers no peer address: its server only fills `X-Forwarded-For` with the
 * socket's address when the request did not bring one (`??=` in base-server), so the header is
 * whatever the client chose to send. We therefore read it only when `TRUST_PROXY=<hops>` says that
 * many proxies of ours stand in front and each appends the address it saw: the client is the entry
 * `hops` places from the right (the leftmost when the chain is shorter). Unset, every request counts
 * as one unknown address (null), and the limits fall back to what needs no address (attempts.ts).
 */
export function clientAddress(headers: Record<string, unknown> | undefined, trustProxy = process.env.TRUST_PROXY): string | null {
  const hops = Number(trustProxy);
  if (!trustProxy || !Number.isInteger(hops) || hops < 1) return null;
  const raw = headers?.["x-forwarded-for"];
  const header = Array.isArray(raw) ? raw.join(",") : raw;
  if (typeof header !== "string") return null;
  const chain = header.split(",").map((s) => s.trim()).filter(Boolean);
  const picked = chain[Math.max(0, chain.length - hops)];
  return picked ? normalise(picked) : null;
}

/** One spelling per address: IPv4-mapped IPv6 as IPv4, lower case, at most 64 characters. */
function normalise(address: string): string {
  const lower = address.toLowerCase().replace(/^::ffff:(?=\d+\.\d+\.\d+\.\d+$)/, "");
  return lower.slice(0, 64);
}
