import puppeteer, { type Browser, type CDPSession, type Page } from "puppeteer-core";

/**
 * The probes' page (bench/cpu-probe.ts, bench/lcp-probe.ts): Debian's Chromium (CHROMIUM_PATH), a fresh context,
 * 4× CPU throttling as Lighthouse's mobile audit, and PROBE_COOKIE as the Cookie header for a signed-in page.
 * The caller goes to PROBE_URL (`url`) and closes `browser`.
 */
export async function openProbePage(): Promise<{ url: string; browser: Browser; page: Page; cdp: CDPSession }> {
  const url = process.env.PROBE_URL;
  if (!url) throw new Error("PROBE_URL=http://127.0.0.1:PORT/page");
  const browser = await puppeteer.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", args: ["--no-sandbox", "--disable-gpu"] });
  const context = await browser.createBrowserContext();
  const page = await context.newPage();
  const cdp = await page.createCDPSession();
  await cdp.send("Emulation.setCPUThrottlingRate", { rate: 4 });
  if (process.env.PROBE_COOKIE) await page.setExtraHTTPHeaders({ cookie: process.env.PROBE_COOKIE });
  return { url, browser, page, cdp };
}
