import { describe, expect, it } from "vitest";
import { buildCsp, createNonce, servedOverHttps } from "@/lib/security/headers";

const directive = (csp: string, name: string) => csp.split("; ").find((d) => d.startsWith(`${name} `));

describe("buildCsp", () => {
  it("allows scripts only by this response's nonce in production, never inline", () => {
    const csp = buildCsp({ nonce: "abc123", dev: false, https: false });
    expect(directive(csp, "script-src")).toBe("script-src 'self' 'nonce-abc123' 'strict-dynamic'");
    expect(csp).not.toMatch(/script-src[^;]*'unsafe-(inline|eval)'/);
    expect(directive(csp, "frame-ancestors")).toBe("frame-ancestors 'none'");
    expect(directive(csp, "object-src")).toBe("object-src 'none'");
    expect(directive(csp, "worker-src")).toBe("worker-src 'self'");
    expect(csp).not.toContain("upgrade-insecure-requests");
  });

  it("adds eval only in development, and upgrades requests only over HTTPS", () => {
    expect(directive(buildCsp({ nonce: "n", dev: true, https: false }), "script-src")).toContain("'unsafe-eval'");
    expect(buildCsp({ nonce: "n", dev: false, https: true })).toContain("upgrade-insecure-requests");
  });
});

describe("buildCsp and object storage", () => {
  it("lets the browser connect to the storage origin for presigned uploads, and nothing else", () => {
    expect(directive(buildCsp({ nonce: "n", dev: false, https: false }), "connect-src")).toBe("connect-src 'self'");
    const csp = buildCsp({ nonce: "n", dev: false, https: false, storage: "http://127.0.0.1:4569/some/path" });
    expect(directive(csp, "connect-src")).toBe("connect-src 'self' http://127.0.0.1:4569");
    expect(directive(buildCsp({ nonce: "n", dev: false, https: false, storage: "javascript:alert(1)" }), "connect-src")).toBe("connect-src 'self'");
  });
});

describe("createNonce", () => {
  it("is fresh each time and fits a CSP nonce source", () => {
    const a = createNonce();
    expect(a).toMatch(/^[A-Za-z0-9+/]{22}==$/);
    expect(createNonce()).not.toBe(a);
  });
});

describe("servedOverHttps", () => {
  it("trusts the proxy's forwarded scheme, else the URL's", () => {
    expect(servedOverHttps(new Headers({ "x-forwarded-proto": "https" }), new URL("http://a/"))).toBe(true);
    expect(servedOverHttps(new Headers({ "x-forwarded-proto": "http" }), new URL("http://a/"))).toBe(false);
    expect(servedOverHttps(new Headers(), new URL("https://a/"))).toBe(true);
    expect(servedOverHttps(new Headers(), new URL("http://127.0.0.1:3000/"))).toBe(false);
  });
});
