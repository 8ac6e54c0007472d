/**
 * First-load weight of the field's pages: `npx tsx bench/first-load.bench.ts` (also run by `npm run bench`).
 * Serves the production build (`next build --webpack` first when there is none), reads each page's
 * HTML and adds up what it makes the browser fetch before anything else: the `<script src>` chunks,
 * the stylesheets and the preloaded fonts, each read from .next/static, raw and gzip-compressed
 * (what travels). The empty page is Next's own runtime, the `rootMainFiles` of the build manifest
 * that every page loads; the ratio says how much the page adds on top. Goal (issue #10): /field
 * ≤ 150 kB of JavaScript (gzip).
 */
import { readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { gzipSync } from "node:zlib";
import { startServer } from "./next-server";

const PAGES = ["/field", "/field/run", "/field/new", "/logbook", "/sign-in"];
const next = join(process.cwd(), ".next");

type Size = { raw: number; gzip: number };
const sizeCache = new Map<string, Size>();
/** A file under .next/static by its URL path, raw and gzip-compressed. */
function sizeOf(url: string): Size {
  const hit = sizeCache.get(url);
  if (hit) return hit;
  const file = join(next, "static", decodeURIComponent(url.replace(/^\/_next\/static\//, "").split("?")[0]!));
  const body = readFileSync(file);
  const size = { raw: body.length, gzip: /\.woff2$/.test(file) ? body.length : gzipSync(body).length };
  sizeCache.set(url, size);
  return size;
}
const sum = (urls: string[]) => urls.map(sizeOf).reduce((a, b) => ({ raw: a.raw + b.raw, gzip: a.gzip + b.gzip }), { raw: 0, gzip: 0 });
const kB = (n: number) => `${(n / 1000).toFixed(1)} kB`;
const unique = (xs: string[]) => [...new Set(xs)];

/** What a page's HTML makes the browser load first, by kind. */
function firstLoad(html: string, link: string) {
  const attrs = (re: RegExp) => unique([...html.matchAll(re)].map((m) => m[1]!)).filter((u) => u.startsWith("/_next/static/"));
  const scripts = attrs(/<script[^>]*?\ssrc="([^"]+)"/g).filter((u) => !/polyfills-/.test(u)); // nomodule: modern browsers skip it
  const css = attrs(/<link[^>]*?rel="stylesheet"[^>]*?href="([^"]+)"/g);
  // Next sends font preloads in the Link header (and, without one, as <link> tags)
  const fonts = unique([...`${link} ${html}`.matchAll(/(\/_next\/static\/media\/[^">]+\.woff2)/g)].map((m) => m[1]!));
  return { scripts, css, fonts };
}

const { base, server } = await startServer();
try {
  const manifest = JSON.parse(readFileSync(join(next, "build-manifest.json"), "utf8")) as { rootMainFiles: string[] };
  const empty = sum(manifest.rootMainFiles.map((f) => `/_next/${f}`));
  const built = statSync(join(next, "BUILD_ID")).mtime.toISOString();
  console.log(`first-load weight per page (build of ${built}); JavaScript gzip / raw`);
  console.log(`${"empty page (Next runtime only)".padEnd(32)} JS ${kB(empty.gzip).padStart(9)} / ${kB(empty.raw).padStart(9)}`);
  for (const path of PAGES) {
    const response = await fetch(`${base}${path}`, { redirect: "manual" });
    const { scripts, css, fonts } = firstLoad(await response.text(), response.headers.get("link") ?? "");
    const js = sum(scripts);
    const styles = sum(css);
    const type = sum(fonts);
    console.log(
      `${path.padEnd(32)} JS ${kB(js.gzip).padStart(9)} / ${kB(js.raw).padStart(9)}  (${(js.gzip / empty.gzip).toFixed(2)}× empty)` +
        `   CSS ${kB(styles.gzip)}   fonts ${kB(type.raw)} (${fonts.length})   all ${kB(js.gzip + styles.gzip + type.raw)}`,
    );
  }
} finally {
  server.kill("SIGTERM");
}
