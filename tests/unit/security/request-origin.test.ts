import { describe, expect, it } from "vitest";
import { checkWriteRequest, isGuardedWrite, ownOrigin } from "@/lib/security/request-origin";

const url = (path: string, base = "http://127.0.0.1:3000") => new URL(path, base);
const headers = (h: Record<string, string>) => new Headers(h);
const json = { "content-type": "application/json", "content-length": "2" };

describe("isGuardedWrite", () => {
  it("guards writes under /api but leaves reads and next-auth's own endpoints alone", () => {
    expect(isGuardedWrite("POST", "/api/sync/push")).toBe(true);
    expect(isGuardedWrite("delete", "/api/account")).toBe(true);
    expect(isGuardedWrite("PATCH", "/api")).toBe(true);
    expect(isGuardedWrite("GET", "/api/sync/pull")).toBe(false);
    expect(isGuardedWrite("HEAD", "/api/sync/pull")).toBe(false);
    expect(isGuardedWrite("POST", "/api/auth/callback/credentials")).toBe(false);
    expect(isGuardedWrite("POST", "/api/authority")).toBe(true); // only the /api/auth/ folder is next-auth's
    expect(isGuardedWrite("POST", "/apis")).toBe(false);
    expect(isGuardedWrite("POST", "/settings")).toBe(false);
  });
  it("leaves the payments webhook to its signature check (the payments service sends no Origin), and only that path", () => {
    expect(isGuardedWrite("POST", "/api/payments/webhook")).toBe(false);
    expect(isGuardedWrite("POST", "/api/payments/webhook/x")).toBe(true);
    expect(isGuardedWrite("POST", "/api/payments")).toBe(true);
  });
});

describe("ownOrigin", () => {
  it("is the request's own Host, so loopback by number and by name both work", () => {
    expect(ownOrigin(headers({ host: "127.0.0.1:3000" }), url("/api/x"))).toBe("http://127.0.0.1:3000");
    expect(ownOrigin(headers({ host: "localhost:3000" }), url("/api/x"))).toBe("http://localhost:3000");
  });
  it("takes the scheme a proxy in front reports", () => {
    expect(ownOrigin(headers({ host: "field.example", "x-forwarded-proto": "https" }), url("/api/x"))).toBe("https://field.example");
  });
});

describe("checkWriteRequest", () => {
  const push = url("/api/sync/push");
  it("lets a same-origin JSON write through, on either loopback name", () => {
    expect(checkWriteRequest("POST", headers({ host: "127.0.0.1:3000", origin: "http://127.0.0.1:3000", ...json }), push)).toBeNull();
    expect(checkWriteRequest("POST", headers({ host: "localhost:3000", origin: "http://localhost:3000", ...json }), push)).toBeNull();
    expect(
      checkWriteRequest("POST", headers({ host: "localhost:3000", origin: "http://localhost:3000", "content-type": "application/json; charset=utf-8" }), push),
    ).toBeNull();
  });

  it("refuses a cross-site origin with 403, whatever the body", () => {
    const refusal = checkWriteRequest("POST", headers({ host: "127.0.0.1:3000", origin: "http://elsewhere.example", ...json }), push);
    expect(refusal).toMatchObject({ status: 403, code: "cross_origin" });
    // another port or scheme of the same host is another origin
    expect(checkWriteRequest("POST", headers({ host: "127.0.0.1:3000", origin: "http://127.0.0.1:4000", ...json }), push)?.status).toBe(403);
    expect(checkWriteRequest("POST", headers({ host: "127.0.0.1:3000", origin: "https://127.0.0.1:3000", ...json }), push)?.status).toBe(403);
    expect(checkWriteRequest("POST", headers({ host: "127.0.0.1:3000", origin: "null", ...json }), push)?.status).toBe(403);
  });

  it("without Origin, accepts only the browser's own Sec-Fetch-Site: same-origin", () => {
    expect(checkWriteRequest("POST", headers({ host: "127.0.0.1:3000", "sec-fetch-site": "same-origin", ...json }), push)).toBeNull();
    expect(checkWriteRequest("POST", headers({ host: "127.0.0.1:3000", "sec-fetch-site": "cross-site", ...json }), push)?.status).toBe(403);
    expect(checkWriteRequest("POST", headers({ host: "127.0.0.1:3000", "sec-fetch-site": "same-site", ...json }), push)?.status).toBe(403);
    expect(checkWriteRequest("POST", headers({ host: "127.0.0.1:3000", ...json }), push)?.status).toBe(403);
  });

  it("refuses a same-origin write that is not JSON with 415 (text/plain and forms need no preflight)", () => {
    const same = { host: "127.0.0.1:3000", origin: "http://127.0.0.1:3000" };
    for (const type of ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x", "application/jsonp"]) {
      expect(checkWriteRequest("POST", headers({ ...same, "content-type": type }), push), type).toMatchObject({ status: 415 });
    }
    expect(checkWriteRequest("PUT", headers(same), push)?.status).toBe(415);
    // a DELETE with no body needs no content type; with a body it must be JSON
    expect(checkWriteRequest("DELETE", headers(same), url("/api/account"))).toBeNull();
    expect(checkWriteRequest("DELETE", headers({ ...same, "content-length": "5", "content-type": "text/plain" }), url("/api/account"))?.status).toBe(415);
  });

  it("checks nothing for reads and next-auth's endpoints", () => {
    expect(checkWriteRequest("GET", headers({ host: "a", origin: "http://b" }), url("/api/sync/pull"))).toBeNull();
    expect(checkWriteRequest("POST", headers({ host: "a", "content-type": "application/x-www-form-urlencoded" }), url("/api/auth/signout"))).toBeNull();
  });
});
