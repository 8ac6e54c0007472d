/**
 * The season bench's page weight: what /season makes the
 * browser load first (the `<script src>` chunks of its HTML, gzip, as bench/first-load.bench.ts counts them).
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { gzipSync } from "node:zlib";

const next = join(process.cwd(), ".next");

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
