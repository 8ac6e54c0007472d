/**
 * Lighthouse mobile performance of the pages a phone opens at the field:
 * `npx tsx --conditions=react-server bench/lighthouse.bench.ts` (run by `npm run bench` when
 * Debian's Chromium is there; never part of npm test). Serves the production build (`next build
 * --webpack` first when there is none) on the database in DATABASE_URL (scripts/bench.sh: the
 * seeded test database), signs in as the seeded demo pilot through next-auth's own endpoints for
 * the signed-in pages, and runs Lighthouse's default mobile audit (simulated slow 4G, 4× slower
 * CPU) RUNS times per page on Chromium (CHROMIUM_PATH, default /usr/bin/chromium; nothing is
 * downloaded). Prints each page's median score and metrics, and the machine's load while measuring:
 * the scores move with it. Goal (issue #10): ≥ 95 on /sign-in and /field. LIGHTHOUSE_REPORTS=DIR
 * keeps every run's full report (JSON) there, to read what Lighthouse found. /offline is measured
 * first as the floor: Next's runtime and nothing else; each other page's "TBT ×floor" line is its
 * median Total Blocking Time over the floor's, both measured in this run (the scores follow the
 * machine's load; the ratio much less). LIGHTHOUSE_PAGES=/sign-in,/field measures only those (no
 * ratio without /offline).
 */
import { spawn } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import lighthouse from "lighthouse";
import { freePort, signIn, startServer } from "./next-server";

const RUNS = Number(process.env.RUNS ?? 3);
// /offline is the floor: a static page of text and two links, so its score is what Next's own
// runtime (the empty page of bench/first-load.bench.ts) costs on this machine before any page code.
// LIGHTHOUSE_PAGES=/sign-in,/field measures only those.
const ALL_PAGES: { path: string; signedIn: boolean }[] = [
  { path: "/offline", signedIn: false },
  { path: "/sign-in", signedIn: false },
  { path: "/field", signedIn: true },
];
const only = process.env.LIGHTHOUSE_PAGES?.split(",").map((s) => s.trim());
const PAGES = only ? ALL_PAGES.filter((p) => only.includes(p.path)) : ALL_PAGES;
const DEMO = { email: "ada@example.com", password: "windowcall-demo" }; // db/seed's demo pilot

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const METRICS = [
  ["first-contentful-paint", "FCP", "ms"],
  ["largest-contentful-paint", "LCP", "ms"],
  ["total-blocking-time", "TBT", "ms"],
  ["cumulative-layout-shift", "CLS", ""],
  ["speed-index", "SI", "ms"],
] as const;
const TBT = METRICS.findIndex(([id]) => id === "total-blocking-time");

const { base, server } = await startServer();
const profile = mkdtempSync(join(tmpdir(), "windowcall-lighthouse-"));
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
  const cookie = await signIn(base, DEMO.email, DEMO.password);
  const loads: number[] = [];
  // each page's median TBT, for the "TBT ×floor" lines: the page's main-thread work beyond Next's own
  // runtime, as a ratio measured in this run, which machine load moves far less than the score
  const tbt = new Map<string, number>();
  console.log(`Lighthouse mobile performance, median of ${RUNS} (simulated slow 4G, 4× CPU), production build`);
  for (const page of PAGES) {
    const runs: { score: number; metrics: number[] }[] = [];
    for (let i = 0; i < RUNS; i++) {
      loads.push(loadavg()[0]!);
      const result = await lighthouse(`${base}${page.path}`, {
        port: debugPort,
        output: "json",
        logLevel: "error",
        onlyCategories: ["performance"],
        extraHeaders: page.signedIn ? { cookie } : undefined,
      });
      const lhr = result?.lhr;
      if (!lhr || lhr.runtimeError) throw new Error(`Lighthouse failed on ${page.path}: ${lhr?.runtimeError?.message ?? "no result"}`);
      if (new URL(lhr.finalDisplayedUrl).pathname !== page.path) throw new Error(`${page.path} ended on ${lhr.finalDisplayedUrl}`);
      const keep = process.env.LIGHTHOUSE_REPORTS;
      if (keep) {
        mkdirSync(keep, { recursive: true });
        writeFileSync(join(keep, `${page.path.replace(/\W+/g, "-").replace(/^-/, "")}-${i + 1}.json`), JSON.stringify(lhr));
      }
      runs.push({ score: Math.round((lhr.categories.performance?.score ?? 0) * 100), metrics: METRICS.map(([id]) => lhr.audits[id]?.numericValue ?? NaN) });
    }
    const metrics = METRICS.map(([, name, unit], m) => {
      const v = median(runs.map((r) => r.metrics[m]!));
      return `${name} ${unit ? Math.round(v) : v.toFixed(3)}${unit}`;
    }).join("  ");
    tbt.set(page.path, median(runs.map((r) => r.metrics[TBT]!)));
    console.log(`${page.path.padEnd(10)} score ${String(median(runs.map((r) => r.score))).padStart(3)} (runs ${runs.map((r) => r.score).join(", ")})   ${metrics}`);
  }
  const floor = tbt.get("/offline");
  for (const [path, ms] of tbt) {
    if (path === "/offline") continue;
    console.log(`${path.padEnd(10)} TBT ×floor ${floor ? (ms / floor).toFixed(2) : "n/a (measure /offline in the same run)"}  (${Math.round(ms)} ms against /offline's ${floor ? Math.round(floor) : "?"} ms)`);
  }
  console.log(`load average while measuring: ${Math.min(...loads).toFixed(1)}–${Math.max(...loads).toFixed(1)} on ${(await import("node:os")).cpus().length} cores`);
} finally {
  server.kill("SIGTERM");
  const closed = new Promise((resolve) => chromium.once("exit", resolve));
  chromium.kill("SIGTERM");
  await closed;
  try {
    rmSync(profile, { recursive: true, force: true, maxRetries: 5 });
  } catch {
    // Chromium's helpers may still be writing into the profile as they exit; it is in the temp folder
  }
}
