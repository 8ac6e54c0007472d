/**
 * Two builds measured in alternating turns (A, B, A, B…) on one Chromium, for comparing a change with
 * main on a loaded machine: `AB_DIRS=/path/to/main,/path/to/branch npx tsx --conditions=react-server
 * bench/lighthouse-ab.ts` (each directory a checkout with a production build; DATABASE_URL a seeded
 * database both serve). Prints each page's median score, TBT and LCP per build, with the load average.
 * LIGHTHOUSE_PAGES and RUNS as in lighthouse.bench.ts; LIGHTHOUSE_REPORTS=DIR keeps the JSON reports.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { cpus, loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import lighthouse from "lighthouse";
import { freePort, signIn } from "./next-server";

const RUNS = Number(process.env.RUNS ?? 3);
const PAGES = (process.env.LIGHTHOUSE_PAGES ?? "/offline,/sign-in,/field").split(",").map((s) => s.trim());
const DIRS = (process.env.AB_DIRS ?? "").split(",").filter(Boolean);
if (DIRS.length < 1) throw new Error("AB_DIRS=dirA,dirB");
const DEMO = { email: "ada@example.com", password: "windowcall-demo" };
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

async function serve(dir: string): Promise<{ base: string; server: ChildProcess }> {
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = spawn(join(dir, "node_modules", ".bin", "next"), ["start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: dir,
    stdio: "ignore",
    env: { ...process.env, NEXTAUTH_URL: base },
  });
  for (let i = 0; !(await fetch(`${base}/offline`).then((r) => r.ok, () => false)); i++) {
    if (i > 300) throw new Error(`next start did not answer in ${dir}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  return { base, server };
}

const servers = await Promise.all(DIRS.map(serve));
const profile = mkdtempSync(join(tmpdir(), "windowcall-lh-ab-"));
const debugPort = await freePort();
const chromium = spawn(
  process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
  ["--headless=new", "--no-sandbox", "--disable-gpu", "--no-first-run", `--remote-debugging-port=${debugPort}`, `--user-data-dir=${profile}`, "about:blank"],
  { stdio: "ignore" },
);
try {
  for (let i = 0; !(await fetch(`http://127.0.0.1:${debugPort}/json/version`).then(() => true, () => false)); i++) {
    if (i > 300) throw new Error("Chromium did not answer");
    await new Promise((r) => setTimeout(r, 200));
  }
  const cookies = await Promise.all(servers.map((s) => signIn(s.base, DEMO.email, DEMO.password)));
  const loads: number[] = [];
  const results = new Map<string, { score: number; tbt: number; lcp: number; fcp: number }[]>();
  for (const path of PAGES) {
    for (let i = 0; i < RUNS; i++) {
      for (let d = 0; d < servers.length; d++) {
        loads.push(loadavg()[0]!);
        const lhr = (
          await lighthouse(`${servers[d]!.base}${path}`, {
            port: debugPort,
            output: "json",
            logLevel: "error",
            onlyCategories: ["performance"],
            extraHeaders: path === "/field" ? { cookie: cookies[d]! } : undefined,
          })
        )?.lhr;
        if (!lhr || lhr.runtimeError) throw new Error(`Lighthouse failed on ${path}: ${lhr?.runtimeError?.message}`);
        if (new URL(lhr.finalDisplayedUrl).pathname !== path) throw new Error(`${path} ended on ${lhr.finalDisplayedUrl}`);
        if (process.env.LIGHTHOUSE_REPORTS) {
          mkdirSync(process.env.LIGHTHOUSE_REPORTS, { recursive: true });
          writeFileSync(join(process.env.LIGHTHOUSE_REPORTS, `${d}${path.replace(/\W+/g, "-")}-${i + 1}.json`), JSON.stringify(lhr));
        }
        const key = `${path} ${d}`;
        const r = { score: Math.round((lhr.categories.performance?.score ?? 0) * 100), tbt: lhr.audits["total-blocking-time"]!.numericValue!, lcp: lhr.audits["largest-contentful-paint"]!.numericValue!, fcp: lhr.audits["first-contentful-paint"]!.numericValue! };
        results.set(key, [...(results.get(key) ?? []), r]);
        console.log(`${path} ${DIRS[d]} run ${i + 1}: score ${r.score} TBT ${Math.round(r.tbt)} LCP ${Math.round(r.lcp)} FCP ${Math.round(r.fcp)} (load ${loadavg()[0]!.toFixed(1)})`);
      }
    }
  }
  for (const [key, rs] of results) {
    const [path, d] = key.split(" ");
    console.log(`${path!.padEnd(9)} ${DIRS[Number(d)]!.padEnd(28)} score ${median(rs.map((r) => r.score))} (${rs.map((r) => r.score).join(", ")})  TBT ${Math.round(median(rs.map((r) => r.tbt)))}  LCP ${Math.round(median(rs.map((r) => r.lcp)))}  FCP ${Math.round(median(rs.map((r) => r.fcp)))}`);
  }
  console.log(`load average while measuring: ${Math.min(...loads).toFixed(1)}–${Math.max(...loads).toFixed(1)} on ${cpus().length} cores`);
} finally {
  for (const s of servers) s.server.kill("SIGTERM");
  const closed = new Promise((resolve) => chromium.once("exit", resolve));
  chromium.kill("SIGTERM");
  await closed;
  try {
    rmSync(profile, { recursive: true, force: true, maxRetries: 5 });
  } catch {
    // Chromium's helpers may still be writing into the profile as they exit; it is in the temp folder
  }
}
