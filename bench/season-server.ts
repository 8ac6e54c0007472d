/**
 * The season bench's HTTP side: the production build served by next's own binary, a pilot signed
 * in through next-auth's credentials endpoint (csrf, then callback), and what /season makes the
 * browser load first (the `<script src>` chunks of its HTML, gzip, as bench/first-load.bench.ts counts them).
 */
import { spawn, execSync, type ChildProcess } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { createServer } from "node:net";
import { join } from "node:path";
import { gzipSync } from "node:zlib";

const next = join(process.cwd(), ".next");

const freePort = () =>
  new Promise<number>((resolve) => {
    const s = createServer().listen(0, "127.0.0.1", () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });

export async function startServer(): Promise<{ base: string; server: ChildProcess }> {
  if (!existsSync(join(next, "BUILD_ID"))) {
    console.log("no production build: running next build --webpack");
    execSync("npx next build --webpack", { stdio: "ignore" });
  }
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = spawn(join(process.cwd(), "node_modules", ".bin", "next"), ["start", "-H", "127.0.0.1", "-p", String(port)], {
    stdio: "ignore", env: { ...process.env, NEXTAUTH_URL: base },
  });
  for (let i = 0; !(await fetch(`${base}/api/health`).then((r) => r.ok, () => false)); i++) {
    if (i > 300) throw new Error("next start did not answer");
    await new Promise((r) => setTimeout(r, 200));
  }
  return { base, server };
}

/** The session cookie of a credentials sign-in. */
export async function signIn(base: string, email: string, password: string): Promise<string> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const jar = csrf.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST", redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: jar, origin: base },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  const session = res.headers.getSetCookie().map((c) => c.split(";")[0]!).find((c) => c.includes("session-token"));
  if (!session) throw new Error(`sign-in failed (${res.status})`);
  return `${jar}; ${session}`;
}

const gzipOf = (url: string) => gzipSync(readFileSync(join(next, "static", decodeURIComponent(url.replace(/^\/_next\/static\//, "").split("?")[0]!)))).length;

/** First-load JavaScript (gzip bytes) of a page's HTML, and of the empty page (Next's runtime). */
export async function firstLoadJs(base: string, path: string, cookie: string): Promise<{ page: number; empty: number }> {
  const html = await (await fetch(`${base}${path}`, { headers: { cookie } })).text();
  const scripts = [...new Set([...html.matchAll(/<script[^>]*?\ssrc="([^"]+)"/g)].map((m) => m[1]!))]
    .filter((u) => u.startsWith("/_next/static/") && !/polyfills-/.test(u));
  if (scripts.length === 0) throw new Error(`${path} loaded no scripts: not signed in?`);
  const manifest = JSON.parse(readFileSync(join(next, "build-manifest.json"), "utf8")) as { rootMainFiles: string[] };
  const sum = (urls: string[]) => urls.reduce((a, u) => a + gzipOf(u), 0);
  return { page: sum(scripts), empty: sum(manifest.rootMainFiles.map((f) => `/_next/${f}`)) };
}
