import { NextRequest } from "next/server";
import { describe, expect, it } from "vitest";
import { proxy } from "@/proxy";

const request = (path: string, init: { method?: string; headers?: Record<string, string> } = {}) =>
  new NextRequest(new URL(path, "http://127.0.0.1:3000"), { method: init.method ?? "GET", headers: { host: "127.0.0.1:3000", ...init.headers } });

describe("proxy", () => {
  it("refuses a cross-site text/plain POST to the API before any route sees it", async () => {
    const res = proxy(request("/api/sync/push", { method: "POST", headers: { origin: "http://elsewhere.example", "content-type": "text/plain" } }));
    expect(res.status).toBe(403);
    expect(await res.json()).toEqual({ error: { code: "cross_origin", message: expect.any(String) } });
  });

  it("passes a same-origin JSON POST on", () => {
    const res = proxy(request("/api/sync/push", { method: "POST", headers: { origin: "http://127.0.0.1:3000", "content-type": "application/json" } }));
    expect(res.headers.get("x-middleware-next")).toBe("1");
  });

  it("gives each page its own nonce in the policy and HSTS only over HTTPS", () => {
    const a = proxy(request("/logbook")).headers.get("content-security-policy")!;
    const b = proxy(request("/logbook")).headers.get("content-security-policy")!;
    expect(a).toMatch(/'nonce-[^']+'/);
    expect(a.match(/'nonce-([^']+)'/)![1]).not.toBe(b.match(/'nonce-([^']+)'/)![1]);
    expect(proxy(request("/logbook")).headers.get("strict-transport-security")).toBeNull();
    expect(proxy(request("/logbook", { headers: { "x-forwarded-proto": "https" } })).headers.get("strict-transport-security")).toMatch(/max-age=\d+/);
  });
});
