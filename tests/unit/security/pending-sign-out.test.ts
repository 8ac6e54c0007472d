import { NextRequest } from "next/server";
import { describe, expect, it } from "vitest";
import { endServerSession } from "@/lib/offline/sign-out";
import { PENDING_SIGN_OUT_COOKIE } from "@/lib/security/pending-sign-out";
import { proxy } from "@/proxy";

const SESSION = "next-auth.session-token=eyJhbGciOi.old.session; next-auth.csrf-token=abc";
const request = (path: string, method = "GET", cookie = `${SESSION}; ${PENDING_SIGN_OUT_COOKIE}=1`) =>
  new NextRequest(new URL(path, "http://127.0.0.1:3000"), {
    method,
    headers: { host: "127.0.0.1:3000", origin: "http://127.0.0.1:3000", "content-type": "application/json", cookie },
  });
const deleted = (res: Response) =>
  res.headers.getSetCookie().filter((c) => /max-age=0/i.test(c)).map((c) => c.split("=")[0]).sort();

/** A page's cookie jar as `document.cookie` behaves for one cookie at path / (set, or deleted by max-age=0). */
function fakeJar() {
  const cookies = new Map<string, string>();
  return {
    cookies,
    get cookie() {
      return [...cookies].map(([k, v]) => `${k}=${v}`).join("; ");
    },
    set cookie(line: string) {
      const [pair] = line.split(";");
      const [name, value] = pair!.split("=") as [string, string];
      if (/max-age=0/.test(line)) cookies.delete(name);
      else cookies.set(name, value);
    },
  };
}

describe("a sign-out started offline is finished by the first request that reaches the server", () => {
  it("the phone keeps a pending mark while next-auth's sign-out cannot reach the server, and drops it when it can", async () => {
    const jar = fakeJar();
    expect(await endServerSession(() => Promise.reject(new TypeError("Failed to fetch")), jar)).toBe(false);
    expect(jar.cookies.get(PENDING_SIGN_OUT_COOKIE)).toBe("1");
    expect(await endServerSession(async () => ({ url: "/" }), jar)).toBe(true);
    expect(jar.cookies.has(PENDING_SIGN_OUT_COOKIE)).toBe(false);
  });

  it("a page or a session read is answered again without the session cookie: nothing is served on the old session", () => {
    for (const path of ["/", "/logbook", "/api/auth/session", "/api/sync/pull?cursor=0"]) {
      const res = proxy(request(path));
      expect(res.status, path).toBe(307);
      expect(new URL(res.headers.get("location")!).pathname + new URL(res.headers.get("location")!).search).toBe(path);
      expect(deleted(res), path).toEqual(["next-auth.session-token", PENDING_SIGN_OUT_COOKIE]);
    }
  });

  it("a write is refused signed out; next-auth's own sign-in and sign-out pass and drop the mark", async () => {
    const push = proxy(request("/api/sync/push", "POST"));
    expect(push.status).toBe(401);
    expect(deleted(push)).toEqual(["next-auth.session-token", PENDING_SIGN_OUT_COOKIE]);
    for (const path of ["/api/auth/callback/credentials", "/api/auth/signout"]) {
      const res = proxy(request(path, "POST"));
      expect(res.headers.get("x-middleware-next"), path).toBe("1");
      expect(deleted(res), path).toEqual([PENDING_SIGN_OUT_COOKIE]);
    }
  });

  it("without the mark nothing changes", () => {
    const res = proxy(request("/logbook", "GET", SESSION));
    expect(res.headers.get("x-middleware-next")).toBe("1");
    expect(deleted(res)).toEqual([]);
  });
});
