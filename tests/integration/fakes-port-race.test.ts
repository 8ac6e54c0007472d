import { execFile } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { afterAll, describe, expect, it } from "vitest";

/**
 * Two checkouts setting up at the same moment can both see the same port free (scripts/lib.sh free_port) and start
 * their fakes on it: one fake then fails with EADDRINUSE. A fake is taken as ready only once it says in its own log
 * that it listens, so the loser tries the next port instead of using the other checkout's fake (which goes away when
 * that checkout stops). Here the race is forced: free_port answers the base port whatever listens on it.
 */
const run = promisify(execFile);
const work = mkdtempSync(join(tmpdir(), "windowcall-fakes-"));
const started: string[] = [];

afterAll(() => {
  for (const dir of started) {
    try {
      process.kill(Number(readFileSync(join(dir, "server.pid"), "utf8")), "SIGTERM");
    } catch {
      // already gone
    }
  }
  rmSync(work, { recursive: true, force: true });
});

/** A port that was free a moment ago, with the next few after it (the tries move up from it). */
async function freeBase(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as { port: number };
  await new Promise((resolve) => server.close(resolve));
  return Math.min(port, 60000);
}

/** Sources scripts/lib.sh as a checkout would, with its fakes' folders under `name`, and prints the fake's port. */
async function setUp(kind: "payments" | "mail", name: string, base: number): Promise<{ port: number; pid: number }> {
  const dir = join(work, name);
  const runDir = kind === "payments" ? `${dir}/payments-server` : `${dir}/mail`;
  const script = [
    "source scripts/lib.sh",
    'free_port() { echo "$1"; }', // the race: every checkout sees the same port free
    `PAY_RUN='${dir}/payments-server' PAY_STATE='${dir}/payments' MAIL_DIR='${dir}/mail'`,
    "unset STRIPE_API_URL",
    "export STRIPE_SECRET_KEY=sk_test_race STRIPE_WEBHOOK_SECRET=whsec_race",
    `export WINDOWCALL_PAYMENTS_PORT=${base} WINDOWCALL_SMTP_PORT=${base} WINDOWCALL_MAILBOX_PORT=${base + 10}`,
    kind === "payments" ? "payments_up >/dev/null" : "mail_up >/dev/null",
    `echo "$(fake_port '${runDir}') $(cat '${runDir}/server.pid')"`,
  ].join("\n");
  started.push(runDir);
  const { stdout } = await run("bash", ["-c", script], { cwd: process.cwd(), timeout: 60_000 });
  const [port = NaN, pid = NaN] = stdout.trim().split(" ").map(Number);
  return { port, pid };
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

describe("local fakes: two checkouts racing for one port (scripts/lib.sh fake_start)", () => {
  for (const kind of ["payments", "mail"] as const) {
    it(`the second ${kind} fake moves to the next port and keeps running`, async () => {
      const base = await freeBase();
      const first = await setUp(kind, `${kind}-a`, base);
      const second = await setUp(kind, `${kind}-b`, base);
      expect(first.port).toBe(base);
      expect(second.port).not.toBe(first.port);
      await new Promise((resolve) => setTimeout(resolve, 1000)); // a fake that lost the port exits within this
      expect(alive(first.pid)).toBe(true);
      expect(alive(second.pid)).toBe(true);
    }, 90_000);
  }
});
