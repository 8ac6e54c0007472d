/**
 * The benches' production server: next's own binary (not npx, so stopping it stops the server
 * itself) on a free loopback port, built first with `next build --webpack` when there is no build,
 * and a sign-in through next-auth's csrf and credentials endpoints, as the sign-in form does.
 */
import { execSync, spawn, type ChildProcess } from "node:child_process";
import { existsSync } from "node:fs";
import { createServer } from "node:net";
import { join } from "node:path";

export const freePort = () =>
  new Promise<number>((resolve) => {
    const s = createServer().listen(0, "127.0.0.1", () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });

/** Serves the build; resolves once `readyPath` answers (/offline needs no database; /api/health does). */
export async function startServer(readyPath = "/offline"): Promise<{ base: string; server: ChildProcess }> {
  if (!existsSync(join(process.cwd(), ".next", "BUILD_ID"))) {
    console.log("no production build: running next build --webpack");
    execSync("npx next build --webpack", { stdio: "ignore" });
  }
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = spawn(join(process.cwd(), "node_modules", ".bin", "next"), ["start", "-H", "127.0.0.1", "-p", String(port)], {
    stdio: "ignore",
    env: { ...process.env, NEXTAUTH_URL: base },
  });
  for (let i = 0; !(await fetch(`${base}${readyPath}`).then((r) => r.ok, () => false)); i++) {
    if (i > 300) {
      server.kill();
      throw new Error("next start did not answer");
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return { base, server };
}

/** The Cookie header of a credentials sign-in (next-auth's csrf cookies and the session cookie). */
export async function signIn(base: string, email: string, password: string): Promise<string> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const jar = csrf.headers.getSetCookie().map((c) => c.split(";")[0]!);
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: jar.join("; "), origin: base },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  const session = res.headers.getSetCookie().map((c) => c.split(";")[0]!).find((c) => c.includes("session-token="));
  if (!session) throw new Error(`sign-in failed (${res.status}): is the demo seeded in DATABASE_URL?`);
  return [...jar, session].join("; ");
}
