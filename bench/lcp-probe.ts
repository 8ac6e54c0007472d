/**
 * Which element is a page's Largest Contentful Paint, and when: `PROBE_URL=http://127.0.0.1:PORT/sign-in
 * npx tsx bench/lcp-probe.ts` (PROBE_COOKIE for a signed-in page). Opens the page in a fresh context of
 * Debian's Chromium with 4× CPU throttling, and prints every LCP candidate (time, element, size) and the
 * fonts' and scripts' response ends, since Lighthouse's largest-contentful-paint-element audit fails on it.
 */
import { openProbePage } from "./probe-page";

const { url, browser, page } = await openProbePage();
try {
  await page.evaluateOnNewDocument(() => {
    (window as unknown as { __lcp: unknown[] }).__lcp = [];
    new PerformanceObserver((list) => {
      for (const e of list.getEntries() as (PerformanceEntry & { element?: Element; size: number; url: string; renderTime: number })[]) {
        (window as unknown as { __lcp: unknown[] }).__lcp.push({
          t: Math.round(e.startTime),
          size: e.size,
          el: e.element ? `${e.element.tagName.toLowerCase()}${e.element.id ? "#" + e.element.id : ""} "${(e.element.textContent ?? "").slice(0, 40)}"` : "(removed)",
          url: e.url,
        });
      }
    }).observe({ type: "largest-contentful-paint", buffered: true });
  });
  await page.goto(url, { waitUntil: "networkidle0" });
  await new Promise((r) => setTimeout(r, 1500));
  const out = await page.evaluate(() => ({
    lcp: (window as unknown as { __lcp: unknown[] }).__lcp,
    fcp: Math.round(performance.getEntriesByName("first-contentful-paint")[0]?.startTime ?? -1),
    res: performance
      .getEntriesByType("resource")
      .map((r) => `${Math.round(r.startTime)}–${Math.round((r as PerformanceResourceTiming).responseEnd)} ${r.name.replace(location.origin, "")}`),
    fonts: [...document.fonts].map((f) => `${f.family} ${f.weight} ${f.status}`),
  }));
  console.log(JSON.stringify(out, null, 1));
} finally {
  await browser.close();
}
