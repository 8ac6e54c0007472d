/**
 * Tap-to-stored latency in Chromium: `npx tsx bench/tap.bench.ts` (also run by `npm run bench`).
 * Presses two buttons with real (CDP) mouse input, interleaved, 1,000 times each, in one page:
 * the field timer's write path (recordEvent: event + outbox in one Dexie transaction, after
 * deciding launch/landing from the stored events) and a bare IndexedDB put of the same
 * record. Prints p50/p99 of each, from the input event's timeStamp to the committed write,
 * and their ratios — measured in this one run (SYNC.md §5: targets live in benchmarks).
 */
import { build } from "esbuild";
import { chromium } from "@playwright/test";

const TAPS = Number(process.env.TAPS ?? 1000);

const bundle = await build({ entryPoints: ["bench/tap-page.ts"], bundle: true, write: false, format: "esm", target: "es2022", tsconfig: "tsconfig.json" });
const script = bundle.outputFiles[0]!.text;
const html = `<!doctype html><meta charset="utf-8"><title>tap bench</title>
<button id="tap" style="position:fixed;left:0;top:0;width:200px;height:200px">tap</button>
<button id="raw" style="position:fixed;left:220px;top:0;width:200px;height:200px">raw</button>
<script type="module" src="/bench.js"></script>`;

const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
  args: ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run"],
});
try {
  const page = await browser.newPage();
  // A made-up origin served from memory: IndexedDB needs a real origin, not about:blank.
  await page.route("http://tap-bench.local/**", (route) => {
    const js = route.request().url().endsWith("/bench.js");
    return route.fulfill({ contentType: js ? "text/javascript" : "text/html", body: js ? script : html });
  });
  await page.goto("http://tap-bench.local/");
  await page.waitForFunction(() => "benchReady" in window);
  await page.evaluate(() => (window as unknown as { benchReady: Promise<void> }).benchReady);
  page.on("console", (m) => console.log("page:", m.text()));
  page.on("pageerror", (e) => console.log("page error:", e.message));

  const count = (which: "tap" | "raw") => page.evaluate((w) => (window as unknown as { benchResults: Record<string, number[]> }).benchResults[w]!.length, which);
  const press = async (x: number, which: "tap" | "raw", expected: number) => {
    await page.mouse.move(x, 100);
    await page.mouse.down();
    await page.mouse.up();
    await page.waitForFunction(
      ([w, n]) => (window as unknown as { benchResults: Record<string, number[]> }).benchResults[w as string]!.length >= (n as number),
      [which, expected] as const,
      { polling: 1, timeout: 5000 },
    ).catch(async (e: unknown) => {
      console.log(await page.evaluate(() => JSON.stringify((window as unknown as { benchResults: unknown }).benchResults)));
      throw e;
    });
  };
  for (let i = 1; i <= TAPS; i++) {
    await press(100, "tap", i);
    await press(320, "raw", i);
  }
  if ((await count("tap")) !== TAPS || (await count("raw")) !== TAPS) throw new Error("taps were lost");
  const results = await page.evaluate(() => (window as unknown as { benchResults: { tap: number[]; raw: number[]; errors: string[] } }).benchResults);
  if (results.errors.length > 0) throw new Error(`writes failed: ${results.errors.join("; ")}`);
  const pct = (xs: number[], p: number) => {
    const s = [...xs].sort((a, b) => a - b);
    return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)]!;
  };
  const row = (name: string, xs: number[]) => `${name.padEnd(34)} p50 ${pct(xs, 50).toFixed(2).padStart(7)} ms   p99 ${pct(xs, 99).toFixed(2).padStart(7)} ms`;
  console.log(`tap-to-stored latency over ${TAPS} taps each, one Chromium page, interleaved`);
  console.log(row("field timer (recordEvent)", results.tap));
  console.log(row("bare IndexedDB put, same record", results.raw));
  console.log(`ratio field/bare: p50 ${(pct(results.tap, 50) / pct(results.raw, 50)).toFixed(2)}×   p99 ${(pct(results.tap, 99) / pct(results.raw, 99)).toFixed(2)}×`);
} finally {
  await browser.close();
}
